import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface ConfirmQuestion {
  title: string;
  message: string;
  /** The label of the button that goes ahead (a verb: "Cancel sweep", "Delete"). */
  confirm: string;
  /** The label of the button that goes back. */
  keep: string;
  /** Red confirm button for actions that cannot be undone. */
  destructive?: boolean;
}

/** Asks before something that cannot be undone; closes with true to go ahead. */
@Component({
  selector: 'app-confirm-dialog',
  imports: [MatButtonModule, MatDialogModule],
  template: `
    <h2 mat-dialog-title>{{ question.title }}</h2>
    <mat-dialog-content><p>{{ question.message }}</p></mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>{{ question.keep }}</button>
      <button mat-flat-button type="button" [class.destructive]="question.destructive" [mat-dialog-close]="true">
        {{ question.confirm }}
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    p { margin: 0; max-width: 48ch; }
    .destructive { --mat-button-filled-container-color: var(--mat-sys-error); --mat-button-filled-label-text-color: var(--mat-sys-on-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly question = inject<ConfirmQuestion>(MAT_DIALOG_DATA);
}
