import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NgTemplateOutlet } from '@angular/common';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import type { Subscription } from 'rxjs';
import { type CsvTable, parseCsvTable } from '../../../../../shared/math/csv-recording';
import { type RecordingInspection, recordingMappingSchema } from '../../../../../shared/schemas/recording';
import { type ApiFailure, toApiFailure } from '../../core/api-failure';
import { schemaIssues, showIssues } from '../../core/schema-issues';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import { BytesPipe } from '../../shared/format/bytes-pipe';
import { CountPipe } from '../../shared/format/count-pipe';
import { ProjectNames } from '../projects/project-names';
import { ColumnMappingForm } from './column-mapping-form';
import { type CsvFault, CsvPreviewTable } from './csv-preview-table';
import { FileDropZone } from './file-drop-zone';
import { MappingPreview } from './mapping-preview';
import { columnRoles, createCoordinateForm, createMappingForm, suggestMapping, toMapping } from './mapping-form-model';
import { RecordingsApi } from './recordings-api';

type Stage = 'choose' | 'reading' | 'map' | 'uploading';

/** Files up to this size are also read in the browser to preview the mapped channels. */
const previewLimitBytes = 20 * 1024 * 1024;

/**
 * Adding a recording: drop or choose a CSV file, see its first rows, map its columns onto time, coordinates,
 * velocities and forces, and upload it. Refusals name the row and column at fault and mark them in the preview.
 */
@Component({
  selector: 'app-recording-upload-page',
  imports: [
    NgTemplateOutlet,
    ReactiveFormsModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    Breadcrumbs,
    BytesPipe,
    CountPipe,
    ColumnMappingForm,
    CsvPreviewTable,
    FileDropZone,
    MappingPreview,
  ],
  template: `
    <app-breadcrumbs [trail]="[{ label: 'Projects', link: ['/projects'] }, { label: projectName(), link: ['/projects', projectId()] }, { label: 'Recordings', link: ['/projects', projectId(), 'recordings'] }, { label: 'Add a recording' }]" />
    <header class="page-header">
      <div>
        <h1 class="page-title">Add a recording</h1>
        <p class="page-subtitle">A CSV file with a header row: a time column, a column per coordinate and, if measured, velocities and the forces on each coordinate.</p>
      </div>
    </header>

    @if (problem(); as p) {
      <div class="callout error" role="alert" data-test="upload-problem">
        <mat-icon aria-hidden="true">error</mat-icon>
        <div>
          <p>{{ p.message }}</p>
          @if (p.where) {
            <p class="where">{{ p.where }}</p>
          }
        </div>
      </div>
    }

    @if (stage() === 'choose' || stage() === 'reading') {
      <app-file-drop-zone hint="Comma-separated, up to 20 MB. Nothing is stored until you upload." [disabled]="stage() === 'reading'" (file)="read($event)" />
    }
    @if (stage() === 'reading') {
      <ng-container *ngTemplateOutlet="progressLine" />
    }

    @if (inspection(); as found) {
      <section class="panel" aria-labelledby="file-heading">
        <div class="file-line">
          <div>
            <h2 id="file-heading" class="section-title">{{ found.fileName }}</h2>
            <p class="muted">{{ found.sizeBytes | bytes }} · {{ found.rowCount | count }} data rows · {{ found.header.length }} columns</p>
          </div>
          <button mat-button type="button" (click)="startOver()" [disabled]="stage() === 'uploading'"><mat-icon>swap_horiz</mat-icon> Choose another file</button>
        </div>
        <app-csv-preview-table [inspection]="found" [roles]="roles()" [fault]="fault()" />
      </section>

      <form class="panel" [formGroup]="form" (ngSubmit)="upload()" novalidate aria-labelledby="mapping-heading">
        <h2 id="mapping-heading" class="section-title">Column mapping</h2>
        <app-column-mapping-form [form]="form" [inspection]="found" (add)="addCoordinate()" (remove)="removeCoordinate($event)" />
        @if (table(); as t) {
          <h3 class="section-title preview-title">Preview of the mapped channels</h3>
          <app-mapping-preview [table]="t" [mapping]="mapping()" />
        }
        @if (stage() === 'uploading') {
          <ng-container *ngTemplateOutlet="progressLine" />
        }
        <div class="form-actions">
          <button mat-button type="button" (click)="cancel()">Cancel</button>
          <button mat-flat-button type="submit" [disabled]="stage() === 'uploading'"><mat-icon>cloud_upload</mat-icon> Upload recording</button>
        </div>
      </form>
    }

    <ng-template #progressLine>
      @if (progress(); as p) {
        <div class="progress" role="status" data-test="upload-progress">
          <span>{{ p.label }}{{ p.percent === null ? '' : ' ' + p.percent + ' %' }}</span>
          <mat-progress-bar [mode]="p.percent === null ? 'indeterminate' : 'determinate'" [value]="p.percent ?? 0" [attr.aria-label]="p.label" />
        </div>
      }
    </ng-template>
  `,
  styles: `
    .progress { display: grid; gap: 6px; margin: 16px 0; font: var(--mat-sys-body-medium); }
    .file-line { display: flex; justify-content: space-between; align-items: flex-start; gap: 16px; margin-bottom: 12px; }
    .file-line p { margin: 0; }
    .where { margin-top: 4px !important; font-weight: 500; }
    form { margin-top: 16px; }
    .preview-title { margin-top: 20px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordingUploadPage {
  private readonly recordingsApi = inject(RecordingsApi);
  private readonly router = inject(Router);
  private readonly fb = inject(FormBuilder);
  private readonly projectNames = inject(ProjectNames);
  readonly projectId = input.required<string>();
  protected readonly projectName = computed(() => this.projectNames.label(this.projectId()));

  protected readonly stage = signal<Stage>('choose');
  protected readonly inspection = signal<RecordingInspection | null>(null);
  private readonly file = signal<File | null>(null);
  protected readonly progress = signal<{ label: string; percent: number | null } | null>(null);
  protected readonly problem = signal<{ message: string; where: string | null } | null>(null);
  protected readonly fault = signal<CsvFault | null>(null);
  protected readonly form = createMappingForm(this.fb);
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly mapping = computed(() => {
    this.value();
    return toMapping(this.form.getRawValue());
  });
  protected readonly roles = computed(() => columnRoles(this.mapping()));
  /** The file read here as well, for the preview; null when it is too large or not readable as CSV. */
  protected readonly table = signal<CsvTable | null>(null);
  private transfer: Subscription | null = null;

  constructor() {
    this.form.valueChanges.subscribe(() => this.validate());
    inject(DestroyRef).onDestroy(() => this.transfer?.unsubscribe());
    effect(() => this.projectNames.ensure(this.projectId()));
  }

  protected read(file: File): void {
    this.problem.set(null);
    this.fault.set(null);
    this.file.set(file);
    this.stage.set('reading');
    this.transfer?.unsubscribe();
    this.transfer = this.recordingsApi.inspect(this.projectId(), file).subscribe({
      next: (step) => {
        if (step.kind === 'progress') {
          this.progress.set({ label: `Reading ${file.name}…`, percent: percentOf(step.sent, step.total ?? file.size) });
          return;
        }
        this.progress.set(null);
        this.inspection.set(step.answer);
        this.prefill(step.answer);
        this.stage.set('map');
        void this.readForPreview(file);
      },
      error: (err: ApiFailure) => {
        this.progress.set(null);
        this.stage.set('choose');
        this.showFailure(err);
      },
    });
  }

  protected upload(): void {
    const file = this.file();
    if (!file || this.stage() === 'uploading') return;
    this.form.markAllAsTouched();
    if (!this.validate()) {
      this.problem.set({ message: 'Some fields need attention; each says what is wrong.', where: null });
      return;
    }
    this.problem.set(null);
    this.fault.set(null);
    this.stage.set('uploading');
    const value = this.form.getRawValue();
    this.transfer = this.recordingsApi.upload(this.projectId(), file, toMapping(value), value.name).subscribe({
      next: (step) => {
        if (step.kind === 'progress') {
          const percent = percentOf(step.sent, step.total ?? file.size);
          this.progress.set({ label: percent !== null && percent >= 100 ? 'Checking every row…' : `Uploading ${file.name}…`, percent: percent !== null && percent >= 100 ? null : percent });
          return;
        }
        this.progress.set(null);
        void this.router.navigate(['/projects', this.projectId(), 'recordings', step.answer.id]);
      },
      error: (err: ApiFailure) => {
        this.progress.set(null);
        this.stage.set('map');
        this.showFailure(err);
      },
    });
  }

  private async readForPreview(file: File): Promise<void> {
    this.table.set(null);
    if (file.size > previewLimitBytes) return;
    try {
      const table = parseCsvTable(await file.text(), file.name);
      if (this.file() === file) this.table.set(table);
    } catch {
      // The server already read the file; its refusal, if any, is what the page shows.
    }
  }

  protected addCoordinate(): void {
    const count = this.form.controls.coordinates.length;
    this.form.controls.coordinates.push(
      createCoordinateForm(this.fb, { name: `q${count + 1}`, column: '', unit: '', velocity: { column: '', unit: '' }, force: { column: '', unit: '' } }),
    );
  }

  protected removeCoordinate(index: number): void {
    this.form.controls.coordinates.removeAt(index);
  }

  protected startOver(): void {
    this.transfer?.unsubscribe();
    this.inspection.set(null);
    this.table.set(null);
    this.file.set(null);
    this.problem.set(null);
    this.fault.set(null);
    this.stage.set('choose');
  }

  protected cancel(): void {
    void this.router.navigate(['/projects', this.projectId(), 'recordings']);
  }

  private prefill(inspection: RecordingInspection): void {
    const guess = suggestMapping(inspection);
    this.form.controls.coordinates.clear({ emitEvent: false });
    for (const draft of guess.coordinates) this.form.controls.coordinates.push(createCoordinateForm(this.fb, draft), { emitEvent: false });
    this.form.patchValue({ name: '', time: { column: guess.timeColumn, unit: 's' } });
  }

  /** Puts the shared schema's messages next to the fields; true when there are none. */
  private validate(): boolean {
    const issues = schemaIssues(recordingMappingSchema, toMapping(this.form.getRawValue()));
    showIssues(this.form, issues);
    return Object.keys(issues).length === 0;
  }

  private showFailure(failure: ApiFailure): void {
    const fields = failure.fields;
    const mappingIssues: Record<string, string> = {};
    for (const [key, message] of Object.entries(fields)) {
      if (key.startsWith('mapping.')) mappingIssues[key.slice('mapping.'.length)] = message;
    }
    if (Object.keys(mappingIssues).length) showIssues(this.form, mappingIssues);
    const row = fields['row'] ? Number(fields['row']) : null;
    const column = fields['column'] ?? null;
    if (row !== null || column !== null) this.fault.set({ row, column });
    const where = [
      fields['line'] ? `Line ${fields['line']} of the file` : null,
      row !== null ? `data row ${row}` : null,
      column !== null ? `column “${column}”` : null,
    ].filter(Boolean);
    // The server's sentence usually names the place already; say it again only when it does not.
    const named = row !== null && failure.message.includes(`row ${row}`);
    this.problem.set({ message: failure.message, where: where.length && !named ? `At: ${where.join(', ')}.` : null });
  }
}

function percentOf(sent: number, total: number): number | null {
  return total > 0 ? Math.min(100, Math.round((100 * sent) / total)) : null;
}
