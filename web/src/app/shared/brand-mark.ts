import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** Conserva's mark: a pendulum bob on its swing. Decorative; the product name always sits beside it. */
@Component({
  selector: 'app-brand-mark',
  template: `
    <svg viewBox="0 0 32 32" [attr.width]="size()" [attr.height]="size()" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="7" class="tile" />
      <path d="M7 9.5a11 11 0 0 0 18 0" class="swing" />
      <line x1="16" y1="5" x2="21.5" y2="21" class="rod" />
      <circle cx="16" cy="5" r="1.8" class="pivot" />
      <circle cx="21.5" cy="22" r="4.2" class="bob" />
    </svg>
  `,
  styles: `
    :host { display: inline-flex; }
    .tile { fill: var(--brand-mark-tile, var(--mat-sys-primary)); }
    .swing { fill: none; stroke: var(--mat-sys-primary-fixed-dim); stroke-width: 2; stroke-linecap: round; }
    .rod { stroke: #fff; stroke-width: 2; stroke-linecap: round; }
    .pivot { fill: #fff; }
    .bob { fill: var(--mat-sys-tertiary-fixed-dim); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BrandMark {
  readonly size = input(32);
}
