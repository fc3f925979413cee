import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { Session } from '../../core/session';
import { CountPipe } from '../../shared/format/count-pipe';
import { DurationPipe } from '../../shared/format/duration-pipe';
import { FigurePipe } from '../../shared/format/figure-pipe';
import { ProjectContext } from './project-context';

/** The project's recordings, with what matters before a sweep: coordinates, length, sampling, forces. */
@Component({
  selector: 'app-project-recordings',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, MatTooltipModule, CountPipe, DurationPipe, FigurePipe],
  template: `
    <div class="tab-bar">
      <p class="section-note">Trajectories of the mechanism: time, the coordinates and, when measured, the forces on them.</p>
      @if (canEdit() && context.recordings()?.length) {
        <a mat-flat-button routerLink="new"><mat-icon>upload_file</mat-icon> Add recording</a>
      }
    </div>
    @if (context.recordings(); as recordings) {
      @if (recordings.length === 0) {
        <div class="empty-state" data-test="recordings-empty">
          <mat-icon aria-hidden="true">timeline</mat-icon>
          <h2>No recordings yet</h2>
          @if (canEdit()) {
            <p>Start here: add a CSV file with a time column and one column per coordinate. You map the columns after choosing the file.</p>
            <a mat-flat-button routerLink="new"><mat-icon>upload_file</mat-icon> Add the first recording</a>
          } @else {
            <p>When an analyst of your team adds a recording, it appears here.</p>
          }
        </div>
      } @else {
        <div class="panel table-panel">
          <table mat-table [dataSource]="recordings" class="data-table" aria-label="Recordings">
            <ng-container matColumnDef="name">
              <th mat-header-cell *matHeaderCellDef>Recording</th>
              <td mat-cell *matCellDef="let r">
                <a class="row-title" [routerLink]="[r.id]">{{ r.name }}</a>
                <div class="muted small">{{ r.fileName }}</div>
              </td>
            </ng-container>
            <ng-container matColumnDef="coordinates">
              <th mat-header-cell *matHeaderCellDef>Coordinates</th>
              <td mat-cell *matCellDef="let r"><span class="mono">{{ r.coordinates.join(', ') }}</span></td>
            </ng-container>
            <ng-container matColumnDef="samples">
              <th mat-header-cell *matHeaderCellDef class="numeric">Samples</th>
              <td mat-cell *matCellDef="let r" class="numeric">{{ r.sampleCount | count }}</td>
            </ng-container>
            <ng-container matColumnDef="duration">
              <th mat-header-cell *matHeaderCellDef class="numeric">Length</th>
              <td mat-cell *matCellDef="let r" class="numeric">{{ r.durationSeconds | duration }}</td>
            </ng-container>
            <ng-container matColumnDef="rate">
              <th mat-header-cell *matHeaderCellDef class="numeric">Rate</th>
              <td mat-cell *matCellDef="let r" class="numeric">
                {{ r.sampling.sampleRate === null ? '–' : (r.sampling.sampleRate | figure: 4) + ' Hz' }}
              </td>
            </ng-container>
            <ng-container matColumnDef="gaps">
              <th mat-header-cell *matHeaderCellDef class="numeric">Gaps</th>
              <td mat-cell *matCellDef="let r" class="numeric" [class.warn]="r.sampling.gapCount > 0">{{ r.sampling.gapCount | count }}</td>
            </ng-container>
            <ng-container matColumnDef="forces">
              <th mat-header-cell *matHeaderCellDef>Forces</th>
              <td mat-cell *matCellDef="let r">{{ r.forced ? 'Recorded' : 'None (passive)' }}</td>
            </ng-container>
            <ng-container matColumnDef="added">
              <th mat-header-cell *matHeaderCellDef>Added</th>
              <td mat-cell *matCellDef="let r">
                {{ r.createdAt | date: 'd MMM y' }}
                <div class="muted small">{{ r.uploadedBy?.name ?? '' }}</div>
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
          </table>
        </div>
      }
    } @else {
      <mat-progress-bar mode="indeterminate" aria-label="Loading recordings" />
    }
  `,
  styles: `
    .warn { color: #8a5a00; font-weight: 500; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectRecordings {
  protected readonly context = inject(ProjectContext);
  protected readonly canEdit = inject(Session).canEdit;
  protected readonly columns = ['name', 'coordinates', 'samples', 'duration', 'rate', 'gaps', 'forces', 'added'];
}
