import { expect } from 'chai';
import { spawnSync } from 'node:child_process';
import { deriveEquationsOfMotion, type LagrangianTerm } from '../../../shared/math/euler-lagrange.js';
import { compileModelDynamics } from '../../../shared/math/model-dynamics.js';
import { sphericalPendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { randomStates, type State } from './random-states.js';

/*
 * Our symbolic Euler-Lagrange against a general-purpose computer algebra system: Debian's python3-sympy, run
 * with the system Python. SymPy derives the equations the textbook way, with the coordinates as functions of
 * time: d/dt (dL/d(dq_i/dt)) - dL/dq_i = u_i, then reads M_ik as the coefficient of d2q_k/dt2 and f as what
 * is left. Both are evaluated at the same sampled states in 30-digit arithmetic.
 */
const PYTHON = '/usr/bin/python3';

const sympyScript = String.raw`
import json, sys
import sympy as sp

data = json.load(sys.stdin)
names = data["coordinates"]
t = sp.Symbol("t")
q = [sp.Symbol(n) for n in names]
dq = [sp.Symbol("d" + n) for n in names]
ddq = [sp.Symbol("dd" + n) for n in names]
u = [sp.Symbol("u_" + n) for n in names]
local = {**{n: s for n, s in zip(names, q)}, **{"d" + n: s for n, s in zip(names, dq)}, "sin": sp.sin, "cos": sp.cos}
L = sum(sp.Rational(c) * sp.sympify(term.replace("^", "**"), locals=local) for term, c in data["lagrangian"])

# Coordinates as functions of time, the textbook derivation.
path = [sp.Function(n)(t) for n in names]
to_time = {**{a: p for a, p in zip(q, path)}, **{b: sp.diff(p, t) for b, p in zip(dq, path)}}
L_t = L.subs(to_time, simultaneous=True)
back = {}
for a, b, c, p in zip(q, dq, ddq, path):
    back[sp.diff(p, t, 2)] = c
    back[sp.diff(p, t)] = b
for a, p in zip(q, path):
    back[p] = a

rows = []
for i, p in enumerate(path):
    lhs = sp.diff(sp.diff(L_t, sp.diff(p, t)), t) - sp.diff(L_t, p)
    rows.append(sp.expand(lhs.subs(back)))
M = [[sp.diff(rows[i], ddq[k]) for k in range(len(names))] for i in range(len(names))]
f = [u[i] - rows[i].subs({c: 0 for c in ddq}) for i in range(len(names))]

out = []
for state in data["states"]:
    values = {}
    for i in range(len(names)):
        values[q[i]] = sp.Rational(state["q"][i])
        values[dq[i]] = sp.Rational(state["dq"][i])
        values[u[i]] = sp.Rational(state["u"][i])
    out.append({
        "M": [[float(sp.N(e.subs(values), 30)) for e in row] for row in M],
        "f": [float(sp.N(e.subs(values), 30)) for e in f],
    })
json.dump(out, sys.stdout)
`;

function requireSympy(): void {
  const probe = spawnSync(PYTHON, ['-c', 'import sympy'], { encoding: 'utf8' });
  if (probe.status !== 0) {
    throw new Error(
      `This check needs SymPy for the system Python (${PYTHON}): install Debian's package with "apt-get install -y python3-sympy". ` +
        `(${(probe.error?.message ?? probe.stderr).trim()})`,
    );
  }
}

function sympyEquations(coordinates: string[], lagrangian: LagrangianTerm[], states: State[]): { M: number[][]; f: number[] }[] {
  const input = JSON.stringify({
    coordinates,
    lagrangian: lagrangian.map((t) => [t.term, String(t.coefficient)]),
    states: states.map((s) => ({ q: s.q.map(String), dq: s.dq.map(String), u: s.u.map(String) })),
  });
  const run = spawnSync(PYTHON, ['-c', sympyScript], { input, encoding: 'utf8', timeout: 120_000 });
  if (run.status !== 0) throw new Error(`SymPy failed: ${run.stderr}`);
  return JSON.parse(run.stdout) as { M: number[][]; f: number[] }[];
}

function expectSameEquations(coordinates: string[], lagrangian: LagrangianTerm[], states: State[]): void {
  const dynamics = compileModelDynamics(deriveEquationsOfMotion(coordinates, lagrangian));
  const n = coordinates.length;
  const matrix = new Float64Array(n * n);
  const force = new Float64Array(n);
  const reference = sympyEquations(coordinates, lagrangian, states);
  let worst = 0;
  states.forEach((s, k) => {
    dynamics.massMatrix(s.q, s.dq, matrix);
    dynamics.forceVector(s.q, s.dq, s.u, force);
    const expected = reference[k]!;
    expected.M.flat().forEach((e, j) => (worst = Math.max(worst, Math.abs(matrix[j]! - e) / Math.max(1, Math.abs(e)))));
    expected.f.forEach((e, i) => (worst = Math.max(worst, Math.abs(force[i]! - e) / Math.max(1, Math.abs(e)))));
  });
  expect(worst).to.be.below(1e-12);
}

describe('equations of motion against a computer algebra system (Debian python3-sympy)', function () {
  this.timeout(180_000);
  before(requireSympy);

  it('gives SymPy\'s mass matrix and force vector for the spherical pendulum (Goldstein) on 25 states', () => {
    const lagrangian = Object.entries(sphericalPendulum.lagrangianTerms).map(([term, coefficient]) => ({ term, coefficient }));
    expectSameEquations(sphericalPendulum.coordinates, lagrangian, randomStates(2, 25, 21, { first: [0.3, 2.8] }));
  });

  it('gives SymPy\'s for a Lagrangian of our own with coupled, velocity-dependent and degree-one terms on 25 states', () => {
    // Our own coefficients; every kind of term the equations meet: coordinate-dependent inertia, a coupling
    // through cos, a quartic velocity term (M depends on dq), a gyroscopic term of degree one, a quotient.
    const lagrangian: LagrangianTerm[] = [
      { term: 'dx^2*(1 + x^2)', coefficient: 0.6180339887 },
      { term: 'dx*dth*cos(th)', coefficient: -0.271828 },
      { term: 'dth^2*sin(th)^2', coefficient: 0.35 },
      { term: 'dth^2', coefficient: 0.9 },
      { term: 'dth^4', coefficient: 0.0123 },
      { term: 'x*dth', coefficient: 0.45 },
      { term: 'x^2*cos(th)', coefficient: -1.7 },
      { term: 'sin(th - x)', coefficient: 2.2 },
      { term: 'dx^2/(2 + cos(th))', coefficient: 0.3 },
    ];
    expectSameEquations(['x', 'th'], lagrangian, randomStates(2, 25, 22));
  });
});
