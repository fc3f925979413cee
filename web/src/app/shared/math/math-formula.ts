import { ChangeDetectionStrategy, Component, type ElementRef, effect, input, signal, viewChild } from '@angular/core';

/**
 * Mathematics, typeset with KaTeX: either LaTeX as given (`tex`), or a term or energy in our notation
 * (`expression`, over `coordinates`), converted first. Both converters are lazy chunks, loaded the first time
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
  readonly coordinates = input<readonly string[]>([]);
  /** Typeset as a display formula (own line, larger). */
  readonly display = input(false);
  /** Text for assistive technology; defaults to the expression or the LaTeX. */
  readonly ariaLabel = input<string | null>(null);

  private readonly target = viewChild.required<ElementRef<HTMLElement>>('target');
  protected readonly fallback = signal<string | null>(null);
  protected readonly label = () => this.ariaLabel() ?? this.expression() ?? this.tex() ?? '';
  /** Typesetting is asynchronous: only the newest request may write into the element. */
  private generation = 0;

  constructor() {
    effect(() => {
      const element = this.target().nativeElement;
      const tex = this.tex();
      const expression = this.expression();
      const coordinates = this.coordinates();
      const display = this.display();
      void this.typeset(element, tex, expression, coordinates, display);
    });
  }

  private async typeset(
    element: HTMLElement,
    tex: string | null,
    expression: string | null,
    coordinates: readonly string[],
    display: boolean,
  ): Promise<void> {
    const generation = ++this.generation;
    let latex = tex;
    if (latex === null && expression !== null) {
      try {
        const { expressionTex } = await import('./expression-tex');
        latex = expressionTex(expression, coordinates);
      } catch {
        if (generation === this.generation) this.fallback.set(expression);
        return;
      }
    }
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
