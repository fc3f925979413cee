import katex from 'katex';

const stylesheetId = 'katex-stylesheet';

/**
 * Typesets LaTeX into an element with KaTeX (lazy chunk). KaTeX's stylesheet and fonts are built into our
 * own origin (angular.json bundle `katex`, not injected) and linked here the first time mathematics shows.
 * `trust` stays off, so no command in the text can add links or styles of its own.
 */
export function renderTex(tex: string, element: HTMLElement, displayMode: boolean): void {
  linkStylesheet();
  katex.render(tex, element, { displayMode, throwOnError: false, output: 'htmlAndMathml', trust: false, strict: 'ignore' });
}

function linkStylesheet(): void {
  if (document.getElementById(stylesheetId)) return;
  const link = document.createElement('link');
  link.id = stylesheetId;
  link.rel = 'stylesheet';
  // The stylesheet's name carries no content hash (it is built as a separate bundle) and the server lets
  // browsers keep files for a year: the version in the address makes a KaTeX upgrade load the new one.
  link.href = `katex.css?v=${katex.version}`;
  document.head.appendChild(link);
}
