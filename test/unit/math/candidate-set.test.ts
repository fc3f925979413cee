import { expect } from 'chai';
import { assembleCandidateSet } from '../../../shared/math/candidate-set.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';
import { sweepSettingsSchema, type SweepSettingsInput } from '../../../shared/schemas/sweep-description.js';

const symbols = new TermSymbols(['th', 'ph']);
const assemble = (input: Partial<SweepSettingsInput>) =>
  assembleCandidateSet(sweepSettingsSchema.parse({ coordinates: ['th', 'ph'], sizes: { max: 2 }, ...input }), symbols);

describe('candidate set', () => {
  it('takes known and reference terms out of the candidates, whatever their spelling', () => {
    const set = assemble({ generate: {}, known: ['dth^2'], reference: { term: 'sin(th)^2*dph^2', coefficient: 0.2 } });
    const texts = set.candidates.map((t) => t.text);
    expect(texts).to.have.length(36); // the 38 generated terms of term-generator.test.ts minus those two
    expect(texts).not.to.include('dth^2');
    expect(texts).not.to.include('dph^2*sin(th)^2');
    expect(set.excluded).to.deep.equal([
      { term: 'dph^2*sin(th)^2', reason: 'equal to, or a constant multiple of, the reference term "sin(th)^2*dph^2"' },
    ]);
  });

  it('leaves out candidates that repeat an earlier one or are a multiple of it, saying which', () => {
    const set = assemble({ terms: ['dth^2', 'cos(th)', 'dth*dth', '2*cos(th)', 'dth^2'] });
    expect(set.candidates.map((t) => t.text)).to.deep.equal(['dth^2', 'cos(th)']);
    expect(set.excluded.map((e) => e.reason)).to.deep.equal([
      'equal to, or a constant multiple of, the candidate "dth^2"',
      'equal to, or a constant multiple of, the candidate "cos(th)"',
      'the same term as the candidate "dth^2"',
    ]);
  });

  it('applies the user\'s additions and removals to the generated set', () => {
    const set = assemble({ generate: { remove: ['th*ph', 'sin(th - ph)'], add: ['dth^4'] } });
    const texts = set.candidates.map((t) => t.text);
    expect(texts).to.have.length(38 - 2 + 1);
    expect(texts).to.include('dth^4');
    expect(texts).not.to.include('th*ph');
    expect(() => assemble({ generate: { remove: ['dth^3'] } })).to.throw(DiscoveryInputError, 'not among the generated terms');
  });

  it('refuses constant terms, repeated known terms and a reference that is also known', () => {
    expect(() => assemble({ terms: ['cos(th)', 'th - th + 2'] })).to.throw(DiscoveryInputError, 'constant');
    expect(() => assemble({ terms: ['cos(th)'], known: ['dth^2', '0.5*dth^2'] })).to.throw(DiscoveryInputError, 'multiples of each other');
    expect(() => assemble({ terms: ['cos(th)'], known: ['dth^2'], reference: { term: 'dth*dth', coefficient: 1 } })).to.throw(
      DiscoveryInputError,
      'is a multiple of the known term',
    );
  });

  it('warns that terms of velocity degree one cannot reach the Lagrangian (method.md section 4)', () => {
    const set = assemble({ terms: ['dth^2', 'th*dph', 'cos(th)'] });
    expect(set.warnings.join(' ')).to.contain('th*dph').and.to.contain('velocity degree one');
  });
});
