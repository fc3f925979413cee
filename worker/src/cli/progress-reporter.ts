import type { DiscoveryProgress } from '../../../shared/math/discover.js';

const INTERVAL_MS = 500;

/** Writes discovery progress to standard error, at most twice a second during the sweep. */
export function progressReporter(write: (line: string) => void): (progress: DiscoveryProgress) => void {
  let lastStage = '';
  let lastTime = 0;
  return (progress) => {
    const now = Date.now();
    if (progress.stage === lastStage && now - lastTime < INTERVAL_MS) return;
    lastStage = progress.stage;
    lastTime = now;
    if (progress.stage === 'signals') write('estimating derivatives and building the regression');
    else if (progress.stage === 'sweep') {
      write(`sweep: ${progress.evaluated + progress.rejected} of ${progress.total} subsets (${progress.rejected} rank deficient)`);
    } else write(`re-fitting the leaderboard (${progress.evaluated} subsets evaluated, ${progress.rejected} rejected)`);
  };
}
