import { expect } from 'chai';
import katex from 'katex';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { compileModelDynamics } from '../../../shared/math/model-dynamics.js';
import { exportC } from '../../../shared/model/export-c.js';
import { exportLatex, modelLatex } from '../../../shared/model/export-latex.js';
import { exportPython } from '../../../shared/model/export-python.js';
import { exportTypeScript } from '../../../shared/model/export-typescript.js';
import { buildModelDocument, documentEquations } from '../../../shared/model/model-document.js';
import { safetyCaution } from '../../../shared/model/safety-caution.js';
import type { ModelDocument } from '../../../shared/schemas/model-document.js';
import { doublePendulum, sphericalPendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { randomStates, type State } from '../math/random-states.js';
import { handbookModelDocument } from './handbook-model.js';

/*
 * The exported code is checked by running it outside the product: the C export compiled by the system compiler
 * (cc), the Python export run by the system Python (/usr/bin/python3), the TypeScript export type-checked by
 * tsc in strict mode and run under tsx. Each must give the product's accelerations to 1e-9 relative.
 */

const root = path.resolve(import.meta.dirname, '../../..');
const PYTHON = '/usr/bin/python3';
const provenance = { source: 'exports test', form: null, estimator: null, recordings: [], sweep: null, scores: null };

/** Our own coupled Lagrangian with every kind of expression the code generator meets: powers, quotients, sums in sin. */
const coupledDocument = buildModelDocument({
  coordinates: ['x', 'th'],
  energy: { terms: ['dx^2*(1 + x^2)', 'dth^2', 'x^2*cos(th)'], coefficients: [0.6180339887, 0.9, 1.7] },
  lagrangian: {
    terms: ['dx^2*(1 + x^2)', 'dx*dth*cos(th)', 'dth^2', 'dth^4', 'x*dth', 'x^2*cos(th)', 'sin(th - x)', 'dx^2/(2 + cos(th))', 'x^5'],
    coefficients: [0.6180339887, -0.271828, 0.9, 0.0123, 0.45, -1.7, 2.2, 0.3, -1e-7],
  },
  provenance,
  title: 'a coupled model of our own',
});

const documents: { name: string; document: ModelDocument; firstRange: [number, number] }[] = [
  { name: 'double pendulum', document: handbookModelDocument(doublePendulum, `${doublePendulum.name} (${doublePendulum.source})`), firstRange: [-3, 3] },
  { name: 'spherical pendulum', document: handbookModelDocument(sphericalPendulum), firstRange: [0.3, 2.8] },
  { name: 'coupled model', document: coupledDocument, firstRange: [-1.5, 1.5] },
];

/** The product's accelerations (null where it calls the mass matrix singular). */
function ourAccelerations(document: ModelDocument, states: State[]): (number[] | null)[] {
  const dynamics = compileModelDynamics(documentEquations(document));
  const ddq = new Float64Array(document.coordinates.length);
  return states.map((s) => (dynamics.accelerations(s.q, s.dq, s.u, ddq) > 0 ? Array.from(ddq) : null));
}

function expectSameAccelerations(theirs: (number[] | null)[], ours: (number[] | null)[]): void {
  expect(theirs).to.have.length(ours.length);
  let worst = 0;
  ours.forEach((expected, k) => {
    if (expected === null) {
      expect(theirs[k], `state ${k}: singular in the product`).to.equal(null);
      return;
    }
    expect(theirs[k], `state ${k}`).to.be.an('array');
    expected.forEach((e, i) => (worst = Math.max(worst, Math.abs(theirs[k]![i]! - e) / Math.max(1e-300, Math.abs(e)))));
  });
  expect(worst).to.be.below(1e-9);
}

function requireTool(command: string, args: string[], install: string): void {
  const probe = spawnSync(command, args, { encoding: 'utf8' });
  if (probe.status !== 0) {
    throw new Error(`This check needs ${command} (${install}); it could not be run: ${(probe.error?.message ?? probe.stderr).trim()}`);
  }
}

/** Comment markers and line breaks removed, so the caution can be found in any export. */
function plainWords(text: string): string {
  return text.replace(/^\s*(\/\/|#|\*|%)/gm, ' ').replace(/\s+/g, ' ');
}

const cDriver = String.raw`
#include <stdio.h>
int conserva_accelerations(const double *q, const double *dq, const double *u, double *ddq);
int main(void) {
  int n, count, k, i;
  double q[8], dq[8], u[8], ddq[8];
  if (scanf("%d %d", &n, &count) != 2) return 2;
  for (k = 0; k < count; k++) {
    for (i = 0; i < n; i++) if (scanf("%lf", &q[i]) != 1) return 2;
    for (i = 0; i < n; i++) if (scanf("%lf", &dq[i]) != 1) return 2;
    for (i = 0; i < n; i++) if (scanf("%lf", &u[i]) != 1) return 2;
    if (conserva_accelerations(q, dq, u, ddq)) { printf("singular\n"); continue; }
    for (i = 0; i < n; i++) printf("%.17g%s", ddq[i], i + 1 < n ? " " : "\n");
  }
  return 0;
}
`;

const pythonDriver = String.raw`
import json, sys
sys.path.insert(0, sys.argv[1])
import model
states = json.load(sys.stdin)
out = []
for s in states:
    try:
        out.append(model.accelerations(s["q"], s["dq"], s["u"]))
    except model.SingularMassMatrix:
        out.append(None)
json.dump(out, sys.stdout)
`;

describe('exports of a model', function () {
  this.timeout(120_000);
  let dir: string;
  before(() => {
    dir = mkdtempSync(path.join(tmpdir(), 'conserva-exports-'));
  });
  after(() => rmSync(dir, { recursive: true, force: true }));

  // A state on the spherical pendulum's coordinate pole (th = 0), where its mass matrix is singular.
  const singular: State = { q: [0, 0.3], dq: [0.5, 0.2], u: [0.1, 0.1] };
  const statesOf = (d: (typeof documents)[number], seed: number) => {
    const states = randomStates(d.document.coordinates.length, 40, seed, { first: d.firstRange });
    return d.name === 'spherical pendulum' ? [...states, singular] : states;
  };

  describe('C (compiled by the system compiler)', () => {
    before(() => requireTool('cc', ['--version'], 'Debian package gcc'));
    for (const d of documents) {
      it(`compiles without warnings as C99 and gives our accelerations to 1e-9: ${d.name}`, () => {
        const folder = mkdtempSync(path.join(dir, 'c-'));
        writeFileSync(path.join(folder, 'model.c'), exportC(d.document));
        writeFileSync(path.join(folder, 'driver.c'), cDriver);
        const binary = path.join(folder, 'driver');
        const build = spawnSync('cc', ['-std=c99', '-Wall', '-Wextra', '-pedantic', '-Werror', '-O2', '-o', binary, 'model.c', 'driver.c', '-lm'], {
          cwd: folder,
          encoding: 'utf8',
        });
        expect(build.status, build.stderr).to.equal(0);
        const states = statesOf(d, 31);
        const input = `${d.document.coordinates.length} ${states.length}\n${states.map((s) => [...s.q, ...s.dq, ...s.u].map(String).join(' ')).join('\n')}\n`;
        const runResult = spawnSync(binary, [], { input, encoding: 'utf8' });
        expect(runResult.status, runResult.stderr).to.equal(0);
        const theirs = runResult.stdout.trim().split('\n').map((line) => (line === 'singular' ? null : line.split(' ').map(Number)));
        expectSameAccelerations(theirs, ourAccelerations(d.document, states));
      });
    }
  });

  describe('Python (run by the system Python, standard library only)', () => {
    before(() => requireTool(PYTHON, ['--version'], 'Debian package python3'));
    for (const d of documents) {
      it(`gives our accelerations to 1e-9: ${d.name}`, () => {
        const folder = mkdtempSync(path.join(dir, 'py-'));
        writeFileSync(path.join(folder, 'model.py'), exportPython(d.document));
        const states = statesOf(d, 32);
        const runResult = spawnSync(PYTHON, ['-c', pythonDriver, folder], { input: JSON.stringify(states), encoding: 'utf8' });
        expect(runResult.status, runResult.stderr).to.equal(0);
        expectSameAccelerations(JSON.parse(runResult.stdout) as (number[] | null)[], ourAccelerations(d.document, states));
      });
    }
  });

  describe('TypeScript (type-checked by tsc --strict, run under tsx)', () => {
    for (const d of documents) {
      it(`type-checks in strict mode and gives our accelerations to 1e-9: ${d.name}`, async () => {
        const folder = mkdtempSync(path.join(dir, 'ts-'));
        const file = path.join(folder, 'model.ts');
        writeFileSync(file, exportTypeScript(d.document));
        const check = spawnSync(
          process.execPath,
          [path.join(root, 'node_modules/typescript/bin/tsc'), '--strict', '--noUncheckedIndexedAccess', '--noEmit', '--target', 'ES2022', '--module', 'ES2022', '--lib', 'ES2022', 'model.ts'],
          { cwd: folder, encoding: 'utf8' },
        );
        expect(check.status, check.stdout).to.equal(0);
        const module = (await import(pathToFileURL(file).href)) as { accelerations(q: number[], dq: number[], u: number[]): number[]; coordinates: string[] };
        expect(module.coordinates).to.deep.equal(d.document.coordinates);
        const states = statesOf(d, 33);
        const theirs = states.map((s) => {
          try {
            return module.accelerations(s.q, s.dq, s.u);
          } catch (error) {
            expect((error as Error).message).to.contain('singular');
            return null;
          }
        });
        expectSameAccelerations(theirs, ourAccelerations(d.document, states));
      });
    }
  });

  describe('LaTeX', () => {
    for (const d of documents) {
      it(`renders every formula with KaTeX (a general-purpose LaTeX math renderer): ${d.name}`, () => {
        const latex = modelLatex(d.document);
        for (const formula of [latex.energy, latex.lagrangian, ...latex.equations, latex.massMatrix, latex.forceVector]) {
          expect(() => katex.renderToString(formula, { throwOnError: true }), formula).not.to.throw();
        }
        expect(latex.equations).to.have.length(d.document.coordinates.length);
      });
    }

    it('writes the Landau & Lifshitz double pendulum with dotted angles, every digit of the coefficients, and the caution', () => {
      const document = handbookModelDocument(doublePendulum);
      const latex = modelLatex(document);
      expect(latex.lagrangian).to.contain('\\dot{\\theta}_{1}^{2}').and.to.contain('\\cos\\left(\\theta_{1} - \\theta_{2}\\right)');
      expect(latex.lagrangian).to.contain(String(doublePendulum.lagrangianTerms['dth1*dth2*cos(th1 - th2)']));
      expect(latex.equations[0]).to.contain('\\ddot{\\theta}_{1}').and.to.contain('u_{\\theta_{1}}');
      const text = exportLatex(document);
      expect(text).to.contain('\\documentclass{article}').and.to.contain('\\end{document}');
      expect(plainWords(text)).to.contain(safetyCaution);
    });
  });

  it('every export carries the safety caution', () => {
    for (const { document } of documents) {
      for (const text of [exportC(document), exportTypeScript(document), exportPython(document), exportLatex(document)]) {
        expect(plainWords(text)).to.contain(safetyCaution);
      }
    }
  });

  it('every code export names the energy and the Lagrangian in its header', () => {
    const document = handbookModelDocument(doublePendulum);
    for (const text of [exportC(document), exportTypeScript(document), exportPython(document)]) {
      expect(text).to.contain(`L = ${document.lagrangian.expression}`).and.to.contain(`E = ${document.energy.expression}`);
    }
  });
});
