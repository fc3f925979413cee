import { Piscina } from 'piscina';
import type { ModelDetails } from '../../../shared/schemas/model-details.js';
import type { StepAnswer } from '../../../shared/sweeps/step-answer.js';
import type { ModelDetailsInput } from './model-details-task.js';

const isTypeScript = import.meta.url.endsWith('.ts');
const taskFile = new URL(`./model-details-task.${isTypeScript ? 'ts' : 'js'}`, import.meta.url).href;

/**
 * One thread that works models out. A model is simulated through every validation recording, which takes
 * from a fraction of a second to many seconds for a stiff model; on the API's main thread that would hold up
 * every other request and the live view.
 */
export class ModelDetailsPool {
  private readonly piscina = new Piscina({ filename: taskFile, minThreads: 0, maxThreads: 1, idleTimeout: 60_000 });

  workOut(input: ModelDetailsInput): Promise<StepAnswer<ModelDetails>> {
    return this.piscina.run(input);
  }

  destroy(): Promise<void> {
    return this.piscina.destroy();
  }
}
