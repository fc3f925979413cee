import type { FormBuilder } from '@angular/forms';
import type { SweepLaunchInput } from '../../../../../shared/schemas/sweep';
import { defaultBalanceSettings, defaultDerivativeSettings } from '../../../../../shared/schemas/sweep-description';

export type RecordingUse = 'train' | 'validate' | 'skip';

/** The launch form; its paths match the launch body's (`settings.sizes.max`) so messages land on fields. */
export function createLaunchForm(fb: FormBuilder) {
  const nn = fb.nonNullable;
  return nn.group({
    name: nn.control(''),
    candidateSetId: nn.control(''),
    settings: nn.group({
      form: nn.control<'balance' | 'derivative'>('balance'),
      sizes: nn.group({ min: nn.control(1), max: nn.control(3) }),
      top: nn.control(10),
      derivatives: nn.group({
        method: nn.control<'savitzky-golay' | 'central'>(defaultDerivativeSettings.method),
        window: nn.control<number>(defaultDerivativeSettings.window),
        order: nn.control<number>(defaultDerivativeSettings.order),
      }),
      balance: nn.group({
        window: nn.control<number>(defaultBalanceSettings.window),
        stride: nn.control<number>(defaultBalanceSettings.stride),
        integration: nn.control<'trapezoid' | 'simpson'>(defaultBalanceSettings.integration),
      }),
    }),
  });
}
export type LaunchForm = ReturnType<typeof createLaunchForm>;

/** The launch body from the form and the chosen use of each recording. */
export function toLaunch(value: ReturnType<LaunchForm['getRawValue']>, uses: ReadonlyMap<string, RecordingUse>): SweepLaunchInput {
  const { settings } = value;
  const ids = (use: RecordingUse) => [...uses.entries()].filter(([, u]) => u === use).map(([id]) => id);
  return {
    ...(value.name.trim() ? { name: value.name.trim() } : {}),
    candidateSetId: value.candidateSetId,
    trainingRecordingIds: ids('train'),
    validationRecordingIds: ids('validate'),
    settings: {
      form: settings.form,
      sizes: { min: Number(settings.sizes.min), max: Number(settings.sizes.max) },
      top: Number(settings.top),
      derivatives:
        settings.derivatives.method === 'central'
          ? { method: 'central' }
          : { method: 'savitzky-golay', window: Number(settings.derivatives.window), order: Number(settings.derivatives.order) },
      balance: {
        window: Number(settings.balance.window),
        stride: Number(settings.balance.stride),
        integration: settings.balance.integration,
      },
    },
  };
}
