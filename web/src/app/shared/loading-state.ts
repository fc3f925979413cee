import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** What a screen shows before its data is there: a progress bar, or why the data could not be loaded. */
@Component({
  selector: 'app-loading-state',
  imports: [MatIconModule, MatProgressBarModule],
  template: `
    @if (failure(); as message) {
      <div class="callout error" role="alert"><mat-icon aria-hidden="true">error</mat-icon><p>{{ message }}</p></div>
    } @else {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="label()" />
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadingState {
  readonly failure = input<string | null>(null);
  /** What is being loaded, for assistive technology: "Loading teams". */
  readonly label = input.required<string>();
}
