import type { EquationsOfMotion } from '../math/euler-lagrange.js';
import type { ModelDocument } from '../schemas/model-document.js';
import { safetyCautionComment } from './safety-caution.js';

/*
 * What every generated source file says about its model, whatever the language: the header comment (model,
 * argument layout, energy, Lagrangian, caution) and how symbols are read from the argument arrays.
 */

/**
 * Reads coordinate i as q[i], its velocity as dq[i], its force as u[i]; `suffix` follows each access (`!` in
 * TypeScript, so the code also compiles with noUncheckedIndexedAccess).
 */
export function arraySymbolReader(equations: EquationsOfMotion, suffix = ''): (name: string) => string {
  const table = new Map<string, string>();
  equations.coordinates.forEach((c, i) => {
    table.set(c, `q[${i}]${suffix}`);
    table.set(`d${c}`, `dq[${i}]${suffix}`);
    table.set(equations.forceSymbols[i]!, `u[${i}]${suffix}`);
  });
  return (name) => {
    const access = table.get(name);
    if (!access) throw new Error(`generated code: no argument holds the symbol ${name}`);
    return access;
  };
}

/** The header comment's lines, each prefixed with `marker` (`//`, `#`, ` *`). */
export function headerCommentLines(document: ModelDocument, marker: string, language: string): string[] {
  const safe = (text: string) => text.replace(/\*\//g, '* /');
  const lines = [
    `Equations of motion of a Conserva model, generated as ${language}${document.title ? `: ${document.title}` : ''}.`,
    `Model document format ${document.format}, version ${document.version}.`,
    '',
    'Arguments, one entry per coordinate in this order:',
    ...document.coordinates.map(
      (c, i) => `  [${i}] ${c}: q = ${c}, dq = ${document.symbols.velocities[i]}, u = ${document.symbols.forces[i]} (generalized force)`,
    ),
    'accelerations solve M(q, dq) ddq = f(q, dq, u), derived by Euler-Lagrange from the Lagrangian:',
    `  L = ${safe(document.lagrangian.expression)}`,
    `Energy: E = ${safe(document.energy.expression)}`,
    ...(document.equations.leftOut.length > 0
      ? [`Left out of the equations (coefficient unknown): ${document.equations.leftOut.join(', ')}`]
      : []),
    '',
  ];
  return [...lines.map((line) => (line ? `${marker} ${line}` : marker)), ...safetyCautionComment(marker)];
}
