import type { EquationsOfMotion } from '../math/euler-lagrange.js';
import { parseExpression } from '../math/term-expression.js';
import { accelerationName, TermSymbols } from '../math/term-symbols.js';
import { binaryNode, negateNode, numberNode, type TermTree } from '../math/term-tree.js';
import type { ModelDocument } from '../schemas/model-document.js';
import { documentEquations } from './model-document.js';
import { safetyCaution } from './safety-caution.js';
import { symbolLatexTable, termLatex } from './term-latex.js';

/** A model's formulas as LaTeX math (without `$` delimiters). */
export interface ModelLatex {
  energy: string;
  lagrangian: string;
  /** One equation per coordinate: sum_k M_ik ddq_k = f_i. */
  equations: string[];
  /** The mass matrix as a pmatrix and the force vector as a column. */
  massMatrix: string;
  forceVector: string;
}

/** The energy, the Lagrangian and the equations of motion of a model document as LaTeX math. */
export function modelLatex(document: ModelDocument): ModelLatex {
  const equations = documentEquations(document);
  const table = symbolLatexTable(document.coordinates, equations.forceSymbols);
  const symbols = new TermSymbols(document.coordinates);
  const combination = (terms: { term: string; coefficient: number | null }[]) =>
    termLatex(linearCombination(terms.map((t) => ({ tree: parseExpression(t.term, symbols).tree, coefficient: t.coefficient }))), table);
  return {
    energy: `E = ${combination(document.energy.terms)}`,
    lagrangian: `L = ${combination(document.lagrangian.terms)}`,
    equations: equationRows(equations).map((row) => termLatex(row.left, table) + ' = ' + termLatex(row.right, table)),
    massMatrix: `M = \\begin{pmatrix} ${equations.massMatrix.map((row) => row.map((e) => termLatex(e, table)).join(' & ')).join(' \\\\ ')} \\end{pmatrix}`,
    forceVector: `f = \\begin{pmatrix} ${equations.forceVector.map((e) => termLatex(e, table)).join(' \\\\ ')} \\end{pmatrix}`,
  };
}

/** sum_j c_j theta_j as one tree: a negative coefficient becomes a subtraction, null coefficients are left out. */
export function linearCombination(parts: { tree: TermTree; coefficient: number | null }[]): TermTree {
  let total: TermTree | null = null;
  for (const { tree, coefficient } of parts) {
    if (coefficient === null) continue;
    const magnitude = binaryNode('multiply', numberNode(Math.abs(coefficient)), tree);
    const negative = coefficient < 0 || Object.is(coefficient, -0);
    if (total === null) total = negative ? negateNode(magnitude) : magnitude;
    else total = binaryNode(negative ? 'subtract' : 'add', total, magnitude);
  }
  return total ?? numberNode(0);
}

/** Rows sum_k M_ik ddq_k = f_i, leaving out zero entries and writing negative numbers as a subtraction. */
function equationRows(equations: EquationsOfMotion): { left: TermTree; right: TermTree }[] {
  return equations.massMatrix.map((row, i) => {
    let left: TermTree | null = null;
    row.forEach((entry, k) => {
      if (entry.kind === 'number' && entry.value === 0) return;
      const acceleration: TermTree = { kind: 'symbol', name: accelerationName(equations.coordinates[k]!) };
      const negative = (entry.kind === 'number' && entry.value < 0) || entry.kind === 'negate';
      const magnitude = entry.kind === 'negate' ? entry.arg : entry.kind === 'number' ? numberNode(Math.abs(entry.value)) : entry;
      const product = binaryNode('multiply', magnitude, acceleration);
      if (left === null) left = negative ? negateNode(product) : product;
      else left = binaryNode(negative ? 'subtract' : 'add', left, product);
    });
    return { left: left ?? numberNode(0), right: equations.forceVector[i]! };
  });
}

/**
 * A complete LaTeX document (article class, amsmath) with the energy, the Lagrangian, the equations of motion
 * and the caution, the caution also as a comment at the top. Pure: returns the text.
 */
export function exportLatex(document: ModelDocument): string {
  const latex = modelLatex(document);
  const escape = (text: string) => text.replace(/([\\{}&%$#_^~])/g, (c) => (c === '\\' ? '\\textbackslash{}' : `\\${c}`));
  const comment = safetyCaution.match(/.{1,96}(\s|$)/g)!.map((line) => `% ${line.trim()}`);
  const rows = latex.equations.map((row) => `  ${row}`).join(' \\\\\n');
  return `% Conserva model${document.title ? `: ${escape(document.title)}` : ''} (${document.format}, version ${document.version})
${comment.join('\n')}
\\documentclass{article}
\\usepackage{amsmath}
\\begin{document}
\\section*{${document.title ? escape(document.title) : 'Conserva model'}}

\\noindent\\textbf{${escape(safetyCaution)}}

\\subsection*{Energy}
\\begin{equation*}
  ${latex.energy}
\\end{equation*}

\\subsection*{Lagrangian}
\\begin{equation*}
  ${latex.lagrangian}
\\end{equation*}

\\subsection*{Equations of motion}
From Euler-Lagrange, $M(q, \\dot q)\\,\\ddot q = f(q, \\dot q, u)$, with $u$ the generalized forces:
\\begin{gather*}
${rows}
\\end{gather*}
\\begin{equation*}
  ${latex.massMatrix}
\\end{equation*}
\\begin{equation*}
  ${latex.forceVector}
\\end{equation*}
\\end{document}
`;
}
