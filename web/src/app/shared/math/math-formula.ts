import { ChangeDetectionStrategy, Component, type ElementRef, effect, input, signal, viewChild } from '@angular/core';

/** Terms with their coefficients, typeset as a sum with rounded coefficients. */
export interface Combination {
  terms: readonly string[];
  coefficients: readonly number[];
}

/**
 * Mathematics, typeset with KaTeX: LaTeX as given (`tex`), a term or energy in our notation (`expression`,
 * over `coordinates`), or terms with coefficients (`combination`, rounded to `digits`), converted first. Both converters are lazy chunks, loaded the first time
 * a formula shows. A term that cannot be read is shown as typed, in a monospace face.
 */
@Component({
  selector: 'app-math',
  template: `
    <span #target class="target" [class.hidden]="fallback() !== null"></span>
    @if (fallback(); as text) {
      <code class="fallback">{{ text }}</code>
    }
  `,
  styles: `
    :host { display: inline-block; max-width: 100%; }
    :host(.block) { display: block; overflow-x: auto; overflow-y: hidden; }
    .hidden { display: none; }
    .fallback { font-size: 0.95em; }
  `,
  host: { '[class.block]': 'display()', '[attr.aria-label]': 'label()', role: 'math' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MathFormula {
  readonly tex = input<string | null>(null);
  readonly expression = input<string | null>(null);
  readonly combination = input<Combination | null>(null);
  readonly digits = input(4);
  /** Written before the formula, such as `E =`. */
  readonly prefix = input('');
  readonly coordinates = input<readonly string[]>([]);
  /** Typeset as a display formula (own line, larger). */
  readonly display = input(false);
  /** Text for assistive technology; defaults to the expression or the LaTeX. */
  readonly ariaLabel = input<string | null>(null);

  private readonly target = viewChild.required<ElementRef<HTMLElement>>('target');
  protected readonly fallback = signal<string | null>(null);
  protected readonly label = () => this.ariaLabel() ?? this.expression() ?? this.tex() ?? this.combinationText();
  /** Typesetting is asynchronous: only the newest request may write into the element. */
  private generation = 0;

  private combinationText(): string {
    const combination = this.combination();
    return combination ? combination.terms.map((t, i) => `${combination.coefficients[i]}*${t}`).join(' + ') : '';
  }

  constructor() {
    effect(() => {
      const element = this.target().nativeElement;
      const tex = this.tex();
      const expression = this.expression();
      const combination = this.combination();
      const digits = this.digits();
      const prefix = this.prefix();
      const coordinates = this.coordinates();
      const display = this.display();
      void this.typeset(element, { tex, expression, combination, digits, prefix }, coordinates, display);
    });
  }

  private async typeset(
    element: HTMLElement,
    what: { tex: string | null; expression: string | null; combination: Combination | null; digits: number; prefix: string },
    coordinates: readonly string[],
    display: boolean,
  ): Promise<void> {
    const generation = ++this.generation;
    let latex = what.tex;
    if (latex === null && (what.expression !== null || what.combination !== null)) {
      try {
        const { combinationTex, expressionTex } = await import('./expression-tex');
        latex = what.combination
          ? combinationTex(what.combination.terms, what.combination.coefficients, coordinates, what.digits)
          : expressionTex(what.expression!, coordinates);
      } catch {
        if (generation === this.generation) this.fallback.set(what.expression ?? what.combination?.terms.join(' + ') ?? '');
        return;
      }
    }
    if (latex !== null && what.prefix) latex = `${what.prefix} ${latex}`;
    if (latex === null) {
      element.textContent = '';
      return;
    }
    const { renderTex } = await import('./katex-render');
    if (generation !== this.generation) return;
    renderTex(latex, element, display);
    this.fallback.set(null);
  }
}
