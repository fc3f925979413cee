import { expect } from 'chai';
import { all, create } from 'mathjs';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { buildModelDocument, parseModelDocument, serializeModelDocument } from '../../../shared/model/model-document.js';
import { safetyCaution } from '../../../shared/model/safety-caution.js';
import { modelDocumentSchema, type ModelDocument } from '../../../shared/schemas/model-document.js';
import { cartPole } from '../../support/mechanisms/handbook-mechanisms.js';

// mathjs, a general-purpose evaluator, reads the expressions of the document as another program would.
const math = create(all, { number: 'number' });

const provenance = {
  source: 'model document test',
  form: 'balance' as const,
  estimator: { method: 'savitzky-golay' as const, window: 9, order: 6 },
  recordings: [{ name: 'run1.csv', role: 'train' as const }],
  sweep: { sizes: { min: 1, max: 3 } },
  scores: null,
};

function cartPoleDocument(): ModelDocument {
  return buildModelDocument({
    coordinates: cartPole.coordinates,
    energy: { terms: Object.keys(cartPole.energyTerms), coefficients: Object.values(cartPole.energyTerms) },
    lagrangian: { terms: Object.keys(cartPole.lagrangianTerms), coefficients: Object.values(cartPole.lagrangianTerms) },
    provenance,
    title: 'cart with a pole',
  });
}

describe('model document (conserva-model, version 1)', () => {
  it('is valid against its schema and carries the caution', () => {
    const document = cartPoleDocument();
    expect(() => modelDocumentSchema.parse(document)).not.to.throw();
    expect(document.format).to.equal('conserva-model');
    expect(document.version).to.equal(1);
    expect(document.caution).to.equal(safetyCaution);
    expect(document.symbols).to.deep.equal({ velocities: ['dx', 'dth'], forces: ['u_x', 'u_th'] });
  });

  it('round-trips through its JSON text unchanged', () => {
    const document = cartPoleDocument();
    const text = serializeModelDocument(document);
    expect(parseModelDocument(text, 'model.json')).to.deep.equal(document);
    expect(serializeModelDocument(parseModelDocument(text, 'model.json'))).to.equal(text);
  });

  it('writes expressions that mathjs evaluates to the handbook energy and Lagrangian (control textbooks\' cart-pole)', () => {
    const document = cartPoleDocument();
    const scope = { x: 0.3, th: 1.1, dx: -0.7, dth: 2.1 };
    const expected = cartPole.energy([scope.x, scope.th], [scope.dx, scope.dth]);
    expect(math.evaluate(document.energy.expression, { ...scope })).to.be.closeTo(expected, 1e-12);
    const { M, m, l, g } = cartPole.parameters as Record<string, number>;
    const lagrangian = ((M! + m!) / 2) * scope.dx ** 2 + m! * l! * scope.dx * scope.dth * Math.cos(scope.th) + ((m! * l! * l!) / 2) * scope.dth ** 2 - m! * g! * l! * Math.cos(scope.th);
    expect(math.evaluate(document.lagrangian.expression, { ...scope })).to.be.closeTo(lagrangian, 1e-12);
  });

  describe('refusals name the file and the problem', () => {
    const text = () => JSON.parse(serializeModelDocument(cartPoleDocument())) as Record<string, unknown>;
    const refuses = (json: unknown, fragment: string) =>
      expect(() => parseModelDocument(typeof json === 'string' ? json : JSON.stringify(json), 'model.json'))
        .to.throw(DiscoveryInputError)
        .with.property('message')
        .that.contains('model.json')
        .and.contains(fragment);

    it('not JSON', () => refuses('{"format": ', 'not valid JSON'));
    it('another format', () => refuses({ ...text(), format: 'something-else' }, '"format" must be "conserva-model"'));
    it('a newer version', () => refuses({ ...text(), version: 2 }, 'version 2'));
    it('a missing field', () => {
      const json = text();
      delete json['lagrangian'];
      refuses(json, 'lagrangian');
    });
    it('a mass matrix of the wrong size', () => {
      const json = text();
      (json['equations'] as Record<string, unknown>)['massMatrix'] = [['1']];
      refuses(json, 'equations.massMatrix');
    });
    it('a term outside the whitelist', () => {
      const json = text();
      (json['lagrangian'] as { terms: { term: string }[] }).terms[0]!.term = 'exp(dx)';
      refuses(json, 'exp(dx)');
    });
    it('a coefficient that is not a number', () => {
      const json = text();
      (json['energy'] as { terms: { coefficient: unknown }[] }).terms[0]!.coefficient = 'big';
      refuses(json, 'energy.terms');
    });
  });

  it('refuses to build from terms and coefficients of different lengths', () => {
    expect(() =>
      buildModelDocument({ coordinates: ['x'], energy: { terms: ['dx^2'], coefficients: [] }, lagrangian: { terms: ['dx^2'], coefficients: [1] }, provenance }),
    ).to.throw(DiscoveryInputError, '1 terms but 0 coefficients');
  });
});
