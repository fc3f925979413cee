import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

/** One step of the trail; the last one is the current screen and carries no link. */
export interface Crumb {
  label: string;
  link?: readonly unknown[];
}

/** Where this screen sits: Projects › project › section › this screen. */
@Component({
  selector: 'app-breadcrumbs',
  imports: [RouterLink, MatIconModule],
  template: `
    <nav aria-label="You are here">
      <ol>
        @for (crumb of trail(); track $index; let last = $last) {
          <li>
            @if (crumb.link && !last) {
              <a [routerLink]="crumb.link">{{ crumb.label }}</a>
              <mat-icon aria-hidden="true">chevron_right</mat-icon>
            } @else {
              <span aria-current="page">{{ crumb.label }}</span>
            }
          </li>
        }
      </ol>
    </nav>
  `,
  styles: `
    ol { display: flex; flex-wrap: wrap; align-items: center; gap: 2px; margin: 0 0 10px; padding: 0; list-style: none; font: var(--mat-sys-body-medium); }
    li { display: flex; align-items: center; gap: 2px; color: var(--mat-sys-on-surface-variant); }
    a { color: var(--mat-sys-primary); text-decoration: none; border-radius: 4px; }
    a:hover { text-decoration: underline; }
    mat-icon { width: 18px; height: 18px; font-size: 18px; color: var(--mat-sys-outline); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Breadcrumbs {
  readonly trail = input.required<readonly Crumb[]>();
}
