import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { type MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import {
  type CandidateSetInputRaw,
  type CandidateSetView,
  type TermCheck,
  candidateSetInputSchema,
} from '../../../../../shared/schemas/candidate-set';
import { safeParsePlain } from '../../../../../shared/schemas/plain-issue-message';
import { coordinateNameSchema, type RecordingView } from '../../../../../shared/schemas/recording';
import { referenceTermSchema } from '../../../../../shared/schemas/sweep-description';
import { toApiFailure } from '../../core/api-failure';
import { FailureNotice } from '../../core/failure-notice';
import { fieldMessage } from '../../core/schema-issues';
import { Session } from '../../core/session';
import { zodValidator } from '../../core/zod-validator';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import { Confirmation } from '../../shared/confirmation';
import { CountPipe } from '../../shared/format/count-pipe';
import { MathFormula } from '../../shared/math/math-formula';
import { ProjectNames } from '../projects/project-names';
import { RecordingsApi } from '../recordings/recordings-api';
import { CandidateSetsApi } from './candidate-sets-api';
import { type GeneratorChoice, GeneratorOptions, defaultGeneratorChoice } from './generator-options';
import { SubsetCounts } from './subset-counts';
import { TermList } from './term-list';
import { type TermRole, type TermRow, rowForField, setFromRows, verdictsByRow } from './term-row';

/** Pause after the last edit before the set is checked on the server. */
const checkDelayMs = 350;
const angleLike = /^(th|theta|phi|ph|psi|alpha|al|beta|be|gamma|ga|q|angle)\d*$/i;

/**
 * Building a candidate set: coordinates, generated terms, terms added and removed by hand, known terms and
 * the reference term. Every edit is checked on the server (which saves nothing) so each term shows whether
 * it is accepted, left out as a repeat, or refused, and the subsets per size follow the edits. Viewers see
 * the same page without any control that changes the set.
 */
@Component({
  selector: 'app-candidate-set-editor',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatProgressBarModule,
    Breadcrumbs,
    CountPipe,
    GeneratorOptions,
    MathFormula,
    SubsetCounts,
    TermList,
  ],
  templateUrl: './candidate-set-editor.html',
  styleUrl: './candidate-set-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CandidateSetEditor {
  private readonly api = inject(CandidateSetsApi);
  private readonly recordingsApi = inject(RecordingsApi);
  private readonly projectNames = inject(ProjectNames);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly confirmation = inject(Confirmation);
  private readonly failureNotice = inject(FailureNotice);
  private readonly fb = inject(FormBuilder);
  private readonly session = inject(Session);
  readonly projectId = input.required<string>();
  /** Absent for a new set. */
  readonly setId = input<string>();

  protected readonly readOnly = computed(() => !this.session.canEdit());
  protected readonly projectName = computed(() => this.projectNames.label(this.projectId()));
  protected readonly loaded = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly saved = signal<CandidateSetView | null>(null);
  protected readonly recordings = signal<RecordingView[]>([]);

  protected readonly name = this.fb.nonNullable.control('', zodValidator(candidateSetInputSchema.shape.name));
  protected readonly referenceCoefficient = this.fb.nonNullable.control<number>(1, zodValidator(referenceTermSchema.shape.coefficient));
  protected readonly newTerm = this.fb.nonNullable.control('');
  protected readonly coordinates = signal<string[]>([]);
  protected readonly coordinateProblem = signal<string | null>(null);
  protected readonly rows = signal<TermRow[]>([]);
  protected readonly generatorChoice = signal<GeneratorChoice>(defaultGeneratorChoice([]));
  private readonly generated = signal(false);
  private readonly removedGenerated = signal<string[]>([]);
  private readonly coefficient = signal(1);
  private nextId = 1;

  protected readonly check = signal<TermCheck | null>(null);
  protected readonly checking = signal(false);
  protected readonly serverErrors = signal<ReadonlyMap<number, string>>(new Map());
  protected readonly setProblem = signal<string | null>(null);
  protected readonly newTermProblem = signal<string | null>(null);
  protected readonly saving = signal(false);

  protected readonly verdicts = computed(() => {
    const check = this.check();
    return check ? verdictsByRow(this.rows(), check) : new Map();
  });
  protected readonly counts = computed(() => {
    const rows = this.rows();
    return {
      candidates: rows.filter((r) => r.role === 'candidate').length,
      known: rows.filter((r) => r.role === 'known').length,
      reference: rows.find((r) => r.role === 'reference') ?? null,
    };
  });
  /** Problems of the set as a whole (not of one term), from the live check. */
  protected readonly wholeSetProblems = computed(() => (this.check()?.problems ?? []).filter((p) => !/^(terms|known)\.\d+$/.test(p.path) && p.path !== 'reference.term'));
  protected readonly recordingCoordinates = computed(() => {
    const seen = new Map<string, string[]>();
    for (const r of this.recordings()) seen.set(r.coordinates.join(', '), r.coordinates);
    return [...seen.entries()].map(([label, coordinates]) => ({ label, coordinates }));
  });
  protected readonly passiveRecordings = computed(() => this.recordings().length > 0 && this.recordings().every((r) => !r.forced));
  protected readonly title = computed(() => this.saved()?.name ?? (this.setId() ? 'Candidate set' : 'New candidate set'));

  constructor() {
    effect(() => this.projectNames.ensure(this.projectId()));
    effect(() => {
      const projectId = this.projectId();
      const setId = this.setId();
      untracked(() => void this.load(projectId, setId));
    });
    this.referenceCoefficient.valueChanges.subscribe((value) => this.coefficient.set(Number(value)));
    // Live check: after each pause in editing, ask the server what it makes of the set.
    let timer: ReturnType<typeof setTimeout> | undefined;
    effect(() => {
      const coordinates = this.coordinates();
      const rows = this.rows();
      const coefficient = this.coefficient();
      if (!this.loaded()) return;
      clearTimeout(timer);
      timer = setTimeout(() => void this.runCheck(coordinates, rows, coefficient), checkDelayMs);
    });
    inject(DestroyRef).onDestroy(() => clearTimeout(timer));
  }

  private async load(projectId: string, setId: string | undefined): Promise<void> {
    this.loaded.set(false);
    this.failure.set(null);
    try {
      const recordings = await this.recordingsApi.list(projectId);
      this.recordings.set(recordings);
      if (setId) {
        this.fill(await this.api.get(setId));
      } else {
        const coordinates = recordings[0]?.coordinates ?? [];
        this.coordinates.set([...coordinates]);
        this.generatorChoice.set(defaultGeneratorChoice(this.likelyAngles(coordinates, recordings)));
      }
      this.loaded.set(true);
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  private fill(set: CandidateSetView): void {
    this.saved.set(set);
    this.name.setValue(set.name);
    this.coordinates.set([...set.coordinates]);
    this.referenceCoefficient.setValue(set.reference?.coefficient ?? 1);
    this.coefficient.set(set.reference?.coefficient ?? 1);
    const rows: TermRow[] = [
      ...set.known.map((text) => this.row(text, 'known', null)),
      ...set.terms.map((text) => this.row(text, 'candidate', set.generator?.add.includes(text) ? 'added' : null)),
      ...(set.reference ? [this.row(set.reference.term, 'reference', null)] : []),
    ];
    this.rows.set(rows);
    if (set.generator) {
      const { add: _add, remove, ...options } = set.generator;
      this.generatorChoice.set({ ...defaultGeneratorChoice(set.coordinates), ...options });
      this.removedGenerated.set([...remove]);
      this.generated.set(true);
    } else {
      this.generatorChoice.set(defaultGeneratorChoice(this.likelyAngles(set.coordinates, this.recordings())));
    }
  }

  /** Angles by the units of the recordings (rad), else by their names. */
  private likelyAngles(coordinates: readonly string[], recordings: readonly RecordingView[]): string[] {
    const radians = new Set<string>();
    for (const r of recordings) for (const c of r.mapping.coordinates) if (/^rad/i.test(c.unit.trim())) radians.add(c.name);
    return coordinates.filter((c) => radians.has(c) || (radians.size === 0 && angleLike.test(c)));
  }

  private row(text: string, role: TermRole, family: TermRow['family']): TermRow {
    return { id: this.nextId++, text, role, family };
  }

  private async runCheck(coordinates: string[], rows: TermRow[], coefficient: number): Promise<void> {
    if (coordinates.length === 0 || rows.length === 0) {
      this.check.set(null);
      return;
    }
    this.checking.set(true);
    try {
      const input = setFromRows(rows, { name: this.name.value, coordinates, referenceCoefficient: Number.isFinite(coefficient) && coefficient !== 0 ? coefficient : 1 });
      const check = await this.api.check(this.projectId(), input);
      // Only the answer to the newest edit counts.
      if (rows === this.rows() && coordinates === this.coordinates()) this.check.set(check);
    } catch (err) {
      this.setProblem.set(toApiFailure(err).message);
    } finally {
      this.checking.set(false);
    }
  }

  protected async generate(choice: GeneratorChoice): Promise<void> {
    this.generatorChoice.set(choice);
    this.setProblem.set(null);
    try {
      const answer = await this.api.generate(this.projectId(), { coordinates: this.coordinates(), generator: { ...choice, add: [], remove: [] } });
      const kept = this.rows().filter((r) => r.role !== 'candidate');
      const keptTexts = new Set(kept.map((r) => r.text));
      this.rows.set([...kept, ...answer.terms.filter((t) => !keptTexts.has(t.text)).map((t) => this.row(t.text, 'candidate', t.family))]);
      this.removedGenerated.set([]);
      this.generated.set(true);
      this.serverErrors.set(new Map());
    } catch (err) {
      this.setProblem.set(toApiFailure(err).message);
    }
  }

  protected async addTerm(): Promise<void> {
    const text = this.newTerm.value.trim();
    if (!text) {
      this.newTermProblem.set('Type a term first, for example dx^2 or cos(th).');
      return;
    }
    if (this.rows().some((r) => r.text === text)) {
      this.newTermProblem.set('This term is in the list already.');
      return;
    }
    const { termProblem } = await import('../../shared/math/expression-tex');
    const problem = this.coordinates().length ? termProblem(text, this.coordinates()) : 'Name the coordinates first.';
    this.newTermProblem.set(problem);
    if (problem) return;
    this.rows.update((rows) => [...rows, this.row(text, 'candidate', 'added')]);
    this.newTerm.setValue('');
  }

  protected setRole(change: { id: number; role: TermRole }): void {
    this.rows.update((rows) =>
      rows.map((r) => {
        if (r.id === change.id) return { ...r, role: change.role };
        // One reference term at most: the earlier one goes back to the candidates.
        if (change.role === 'reference' && r.role === 'reference') return { ...r, role: 'candidate' };
        return r;
      }),
    );
    this.clearServerError(change.id);
  }

  protected removeTerm(id: number): void {
    const row = this.rows().find((r) => r.id === id);
    if (row?.family && row.family !== 'added') this.removedGenerated.update((list) => [...list, row.text]);
    this.rows.update((rows) => rows.filter((r) => r.id !== id));
    this.clearServerError(id);
  }

  protected removeAllCandidates(): void {
    this.rows.update((rows) => rows.filter((r) => r.role !== 'candidate'));
    this.removedGenerated.set([]);
    this.generated.set(false);
  }

  protected addCoordinate(event: MatChipInputEvent): void {
    const name = event.value.trim();
    event.chipInput.clear();
    if (!name) return;
    const parsed = safeParsePlain(coordinateNameSchema, name);
    if (!parsed.success) {
      this.coordinateProblem.set(parsed.error.issues[0]?.message ?? 'Not a valid coordinate name.');
      return;
    }
    if (this.coordinates().includes(name)) {
      this.coordinateProblem.set(`"${name}" is a coordinate already.`);
      return;
    }
    this.coordinateProblem.set(null);
    this.coordinates.update((list) => [...list, name]);
  }

  protected removeCoordinate(name: string): void {
    this.coordinates.update((list) => list.filter((c) => c !== name));
  }

  protected useCoordinates(coordinates: string[]): void {
    this.coordinates.set([...coordinates]);
    this.coordinateProblem.set(null);
    this.generatorChoice.set(defaultGeneratorChoice(this.likelyAngles(coordinates, this.recordings())));
  }

  protected message(control: Parameters<typeof fieldMessage>[0]): string {
    return fieldMessage(control);
  }

  protected async save(): Promise<void> {
    if (this.saving()) return;
    this.name.markAsTouched();
    this.referenceCoefficient.markAsTouched();
    this.setProblem.set(null);
    if (this.coordinates().length === 0) this.coordinateProblem.set('Name at least one coordinate.');
    if (this.name.invalid || this.coordinates().length === 0 || (this.counts().reference && this.referenceCoefficient.invalid)) {
      this.setProblem.set('Some fields need attention; each says what is wrong.');
      return;
    }
    const rows = this.rows();
    const choice = this.generatorChoice();
    const input: CandidateSetInputRaw = {
      ...setFromRows(rows, { name: this.name.value, coordinates: this.coordinates(), referenceCoefficient: this.referenceCoefficient.value }),
      name: this.name.value,
      generator: this.generated()
        ? { ...choice, add: rows.filter((r) => r.family === 'added' && r.role === 'candidate').map((r) => r.text), remove: this.removedGenerated() }
        : null,
    };
    this.saving.set(true);
    try {
      const existing = this.saved();
      const set = existing ? await this.api.update(existing.id, input) : await this.api.create(this.projectId(), input);
      this.saved.set(set);
      this.snackBar.open(`Candidate set “${set.name}” saved: ${set.candidateCount} candidates.`, 'Close', { duration: 5000 });
      if (!existing) void this.router.navigate(['/projects', this.projectId(), 'candidate-sets', set.id], { replaceUrl: true });
    } catch (err) {
      const failure = toApiFailure(err);
      const errors = new Map<number, string>();
      for (const [key, message] of Object.entries(failure.fields)) {
        const id = rowForField(rows, key);
        if (id !== null) errors.set(id, message);
        else if (key === 'name') this.name.setErrors({ server: message });
        else if (key.startsWith('coordinates')) this.coordinateProblem.set(message);
        else if (key.startsWith('reference.coefficient')) this.referenceCoefficient.setErrors({ server: message });
      }
      this.serverErrors.set(errors);
      this.setProblem.set(failure.message);
    } finally {
      this.saving.set(false);
    }
  }

  protected async remove(): Promise<void> {
    const set = this.saved();
    if (!set) return;
    const yes = await this.confirmation.ask({
      title: 'Delete this candidate set?',
      message: `“${set.name}” is removed for everyone in the team. Sweeps launched with it keep their own copy.`,
      confirm: 'Delete candidate set',
      keep: 'Keep it',
      destructive: true,
    });
    if (!yes) return;
    try {
      await this.api.delete(set.id);
      void this.router.navigate(['/projects', this.projectId(), 'candidate-sets']);
    } catch (err) {
      this.failureNotice.show(err);
    }
  }

  private clearServerError(id: number): void {
    if (!this.serverErrors().has(id)) return;
    const next = new Map(this.serverErrors());
    next.delete(id);
    this.serverErrors.set(next);
  }
}
