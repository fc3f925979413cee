import { expect } from 'chai';
import type { WorkedModel } from '../../../shared/math/leaderboard-models.js';
import { rankingTolerance, rankModels } from '../../../shared/math/model-choice.js';

function model(name: string, size: number, validationRmse: number, bic: number): WorkedModel {
  return { terms: [name], size, validationRmse, bic } as unknown as WorkedModel;
}

// The rule under test is ours (method.md section 3 and model-choice.ts): among models the data cannot tell
// apart, the smallest ranks first.
describe('model choice across sizes', () => {
  const models = [model('small', 2, 1.03e-3, -500), model('large', 3, 1.0e-3, -520), model('worse', 2, 5e-3, -300)];

  it('ranks by validation error, preferring the smaller of two models within 5 % of the best', () => {
    const ranked = rankModels(models, { criterion: 'validation', tolerance: rankingTolerance('validation', 1e-3, null), stopSize: null });
    expect(ranked.map((m) => m.terms[0])).to.deep.equal(['small', 'large', 'worse']);
  });

  it('keeps the larger model first when it is clearly better', () => {
    const clear = [model('small', 2, 1.2e-3, -500), ...models.slice(1)];
    const ranked = rankModels(clear, { criterion: 'validation', tolerance: rankingTolerance('validation', 1e-3, null), stopSize: null });
    expect(ranked[0]!.terms[0]).to.equal('large');
  });

  it('widens the tolerance to the noise floor of the validation residual', () => {
    const clear = [model('small', 2, 1.2e-3, -500), ...models.slice(1)];
    const ranked = rankModels(clear, { criterion: 'validation', tolerance: rankingTolerance('validation', 1e-3, 3e-4), stopSize: null });
    expect(ranked[0]!.terms[0]).to.equal('small');
  });

  it('ranks by BIC without validation, within 2 of the best counting as a tie', () => {
    expect(rankModels(models, { criterion: 'bic', tolerance: rankingTolerance('bic', null, null), stopSize: null })[0]!.terms[0]).to.equal('large');
    const close = [model('small', 2, 0, -519), model('large', 3, 0, -520)];
    expect(rankModels(close, { criterion: 'bic', tolerance: 2, stopSize: null })[0]!.terms[0]).to.equal('small');
  });

  it('puts models above the noise-floor stop after all others', () => {
    const ranked = rankModels(models, { criterion: 'bic', tolerance: 2, stopSize: 2 });
    expect(ranked.map((m) => m.terms[0])).to.deep.equal(['small', 'worse', 'large']);
  });
});
