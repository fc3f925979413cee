import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import { ConfirmDialog, type ConfirmQuestion } from './confirm-dialog';

/** Asks before something that cannot be undone; resolves true only when the person goes ahead. */
@Injectable({ providedIn: 'root' })
export class Confirmation {
  private readonly dialog = inject(MatDialog);

  async ask(question: ConfirmQuestion): Promise<boolean> {
    const answer = await firstValueFrom(this.dialog.open(ConfirmDialog, { data: question }).afterClosed(), { defaultValue: false });
    return answer === true;
  }
}
