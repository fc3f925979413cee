import { Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { toApiFailure } from './api-failure';

/** Says in a snack bar why an action that has no form of its own (delete, cancel, change in place) failed. */
@Injectable({ providedIn: 'root' })
export class FailureNotice {
  private readonly snackBar = inject(MatSnackBar);

  show(err: unknown): void {
    this.snackBar.open(toApiFailure(err).message, 'Close', { duration: 8000 });
  }
}
