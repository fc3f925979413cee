import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { Session } from '../../core/session';
import { CountPipe } from '../../shared/format/count-pipe';
import { MathFormula } from '../../shared/math/math-formula';
import { ProjectContext } from './project-context';

/** The project's candidate sets: how many terms each offers, its known terms and its reference term. */
@Component({
  selector: 'app-project-candidate-sets',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, CountPipe, MathFormula],
  template: `
    <div class="tab-bar">
      <p class="section-note">The terms a sweep may combine into an energy, the known terms every model keeps, and the reference term.</p>
      @if (canEdit() && context.candidateSets()?.length) {
        <a mat-flat-button routerLink="new"><mat-icon>add</mat-icon> New candidate set</a>
      }
    </div>
    @if (context.candidateSets(); as sets) {
      @if (sets.length === 0) {
        <div class="empty-state" data-test="candidate-sets-empty">
          <mat-icon aria-hidden="true">functions</mat-icon>
          <h2>No candidate sets yet</h2>
          @if (canEdit()) {
            <p>Generate terms from a few options (powers, sines and cosines, kinetic terms), then add, remove and mark terms.</p>
            <a mat-flat-button routerLink="new"><mat-icon>add</mat-icon> Build a candidate set</a>
          } @else {
            <p>When an analyst of your team builds a candidate set, it appears here.</p>
          }
        </div>
      } @else {
        <div class="panel table-panel">
          <table mat-table [dataSource]="sets" class="data-table" aria-label="Candidate sets">
            <ng-container matColumnDef="name">
              <th mat-header-cell *matHeaderCellDef>Candidate set</th>
              <td mat-cell *matCellDef="let s"><a class="row-title" [routerLink]="[s.id]">{{ s.name }}</a></td>
            </ng-container>
            <ng-container matColumnDef="coordinates">
              <th mat-header-cell *matHeaderCellDef>Coordinates</th>
              <td mat-cell *matCellDef="let s"><span class="mono">{{ s.coordinates.join(', ') }}</span></td>
            </ng-container>
            <ng-container matColumnDef="candidates">
              <th mat-header-cell *matHeaderCellDef class="numeric">Candidates</th>
              <td mat-cell *matCellDef="let s" class="numeric">{{ s.candidateCount | count }}</td>
            </ng-container>
            <ng-container matColumnDef="known">
              <th mat-header-cell *matHeaderCellDef>Known terms</th>
              <td mat-cell *matCellDef="let s">
                @for (term of s.known; track $index) {
                  <app-math class="term" [expression]="term" [coordinates]="s.coordinates" />
                } @empty {
                  <span class="muted">none</span>
                }
              </td>
            </ng-container>
            <ng-container matColumnDef="reference">
              <th mat-header-cell *matHeaderCellDef>Reference term</th>
              <td mat-cell *matCellDef="let s">
                @if (s.reference; as reference) {
                  <app-math [expression]="reference.term" [coordinates]="s.coordinates" />
                  <span class="muted"> fixed at {{ reference.coefficient }}</span>
                } @else {
                  <span class="muted">none</span>
                }
              </td>
            </ng-container>
            <ng-container matColumnDef="updated">
              <th mat-header-cell *matHeaderCellDef>Changed</th>
              <td mat-cell *matCellDef="let s">{{ s.updatedAt | date: 'd MMM y, HH:mm' }}</td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
          </table>
        </div>
      }
    } @else {
      <mat-progress-bar mode="indeterminate" aria-label="Loading candidate sets" />
    }
  `,
  styles: `
    .term + .term { margin-left: 12px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectCandidateSets {
  protected readonly context = inject(ProjectContext);
  protected readonly canEdit = inject(Session).canEdit;
  protected readonly columns = ['name', 'coordinates', 'candidates', 'known', 'reference', 'updated'];
}
