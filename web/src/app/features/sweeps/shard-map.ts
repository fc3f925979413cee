import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTooltipModule } from '@angular/material/tooltip';
import { type ShardState, type ShardSummary, shardStates } from '../../../../../shared/schemas/sweep';
import { formatCount } from '../../shared/format/count-pipe';
import { formatDuration } from '../../shared/format/duration-pipe';

const stateLabels: Record<ShardState, string> = { queued: 'queued', running: 'running', done: 'done', cancelled: 'cancelled', failed: 'failed' };

/** Every shard of a sweep as a small tile coloured by its state, with a count per state. */
@Component({
  selector: 'app-shard-map',
  imports: [MatTooltipModule],
  template: `
    <ul class="legend" aria-label="Shards by state">
      @for (entry of tally(); track entry.state) {
        <li><i [class]="entry.state"></i>{{ entry.count }} {{ entry.label }}</li>
      }
    </ul>
    @if (shards().length) {
      <ol class="tiles" aria-label="Shards">
        @for (shard of shards(); track shard.id) {
          <li [class]="shard.state" [matTooltip]="describe(shard)" [attr.aria-label]="describe(shard)" tabindex="0"></li>
        }
      </ol>
    } @else {
      <p class="muted">The shards are planned when a worker prepares the sweep.</p>
    }
  `,
  styles: `
    .legend { display: flex; flex-wrap: wrap; gap: 4px 16px; margin: 0 0 10px; padding: 0; list-style: none; font: var(--mat-sys-body-small); }
    .legend i { display: inline-block; width: 10px; height: 10px; margin-right: 6px; border-radius: 2px; vertical-align: -1px; }
    .tiles { display: flex; flex-wrap: wrap; gap: 3px; margin: 0; padding: 0; list-style: none; }
    .tiles li { width: 14px; height: 14px; border-radius: 3px; }
    .queued { background: var(--mat-sys-surface-container-highest); }
    .running { background: var(--mat-sys-primary-fixed-dim); outline: 2px solid var(--mat-sys-primary); outline-offset: -2px; }
    .done { background: var(--mat-sys-primary); }
    .cancelled { background: var(--mat-sys-outline); }
    .failed { background: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShardMap {
  readonly shards = input.required<readonly ShardSummary[]>();

  protected readonly tally = computed(() =>
    shardStates
      .map((state) => ({ state, label: stateLabels[state], count: this.shards().filter((s) => s.state === state).length }))
      .filter((entry) => entry.count > 0 || entry.state === 'done'),
  );

  protected describe(shard: ShardSummary): string {
    const sizes = [...new Set(shard.slices.map((s) => s.size))].join(', ');
    const parts = [`Shard ${shard.index + 1}: ${stateLabels[shard.state]}`, `${formatCount(shard.subsets)} subsets of size ${sizes}`];
    if (shard.state !== 'queued') parts.push(`${formatCount(shard.evaluated + shard.rejected)} tried`, `CPU ${formatDuration(shard.cpuSeconds)}`);
    if (shard.worker) parts.push(`on ${shard.worker}`);
    if (shard.attempts > 1) parts.push(`attempt ${shard.attempts}`);
    return parts.join(' · ');
  }
}
