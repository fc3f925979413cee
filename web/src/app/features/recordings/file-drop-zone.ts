import { ChangeDetectionStrategy, Component, type ElementRef, input, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** Where a file arrives: dropped onto the zone, or chosen with the button (keyboard and screen readers). */
@Component({
  selector: 'app-file-drop-zone',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div
      class="zone"
      [class.over]="over()"
      [class.busy]="disabled()"
      (dragenter)="enter($event)"
      (dragover)="enter($event)"
      (dragleave)="over.set(false)"
      (drop)="drop($event)"
      data-test="drop-zone"
    >
      <mat-icon aria-hidden="true">upload_file</mat-icon>
      <p class="lead">Drop a CSV file here</p>
      <p class="muted">{{ hint() }}</p>
      <input #picker type="file" [accept]="accept()" class="visually-hidden" tabindex="-1" aria-hidden="true" (change)="pick($event)" />
      <button mat-stroked-button type="button" (click)="picker.click()" [disabled]="disabled()">
        <mat-icon>folder_open</mat-icon> Choose a file
      </button>
    </div>
  `,
  styles: `
    .zone {
      display: flex; flex-direction: column; align-items: center; gap: 6px; padding: 32px 24px;
      border: 2px dashed var(--mat-sys-outline-variant); border-radius: var(--mat-sys-corner-large);
      background: var(--mat-sys-surface); text-align: center; transition: background 120ms, border-color 120ms;
    }
    .zone.over { border-color: var(--mat-sys-primary); background: var(--mat-sys-primary-container); }
    .zone.busy { opacity: 0.6; }
    mat-icon { width: 40px; height: 40px; font-size: 40px; color: var(--mat-sys-primary); }
    .lead { margin: 4px 0 0; font: var(--mat-sys-title-medium); }
    p { margin: 0; }
    button { margin-top: 10px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FileDropZone {
  readonly accept = input('.csv,text/csv');
  readonly hint = input('');
  readonly disabled = input(false);
  readonly file = output<File>();
  private readonly picker = viewChild.required<ElementRef<HTMLInputElement>>('picker');
  protected readonly over = signal(false);

  protected enter(event: DragEvent): void {
    event.preventDefault();
    if (!this.disabled()) this.over.set(true);
  }

  protected drop(event: DragEvent): void {
    event.preventDefault();
    this.over.set(false);
    const file = event.dataTransfer?.files?.[0];
    if (file && !this.disabled()) this.file.emit(file);
  }

  protected pick(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    if (file) this.file.emit(file);
    // Let the same file be chosen again after a fix on disk.
    this.picker().nativeElement.value = '';
  }
}
