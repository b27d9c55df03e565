/**
 * The `couplet.*` settings as the panel needs them. Pure: the VS Code configuration is passed in as
 * a getter, so the defaults and bounds (which must match package.json, see the test) are checked in Node.
 */
import type { ViewSettings } from '../protocol';

/** Reads one setting by its full key (e.g. `couplet.contours.levels`); undefined when not set. */
export type SettingGetter = (key: string) => unknown;

interface NumberSetting {
  readonly key: string;
  readonly default: number;
  readonly minimum: number;
  readonly maximum: number;
  readonly integer: boolean;
}

/** Defaults and bounds; package.json `contributes.configuration` declares the same (tested). */
export const NUMBER_SETTINGS = {
  lowestLevel: { key: 'couplet.contours.lowestLevel', default: 8, minimum: 1, maximum: 1000, integer: false },
  levels: { key: 'couplet.contours.levels', default: 10, minimum: 1, maximum: 40, integer: true },
  spacing: { key: 'couplet.contours.spacing', default: 1.4, minimum: 1.05, maximum: 4, integer: false },
  jDecimals: { key: 'couplet.display.jDecimals', default: 2, minimum: 0, maximum: 4, integer: true },
} as const satisfies Record<string, NumberSetting>;

export const METHOD_SETTING = { key: 'couplet.measure.defaultMethod', default: 'fit', values: ['fit', 'naive'] } as const;

/**
 * A value the user typed in settings.json can be anything: a wrong type falls back to the default,
 * an out-of-range number is clamped (VS Code only warns about bounds, it does not enforce them).
 */
function numberSetting(get: SettingGetter, s: NumberSetting): number {
  const v = get(s.key);
  if (typeof v !== 'number' || !Number.isFinite(v)) return s.default;
  const clamped = Math.min(s.maximum, Math.max(s.minimum, v));
  return s.integer ? Math.round(clamped) : clamped;
}

export function readSettings(get: SettingGetter): ViewSettings {
  const method = get(METHOD_SETTING.key);
  return {
    contours: {
      lowestLevel: numberSetting(get, NUMBER_SETTINGS.lowestLevel),
      levels: numberSetting(get, NUMBER_SETTINGS.levels),
      spacing: numberSetting(get, NUMBER_SETTINGS.spacing),
    },
    defaultMethod: method === 'naive' || method === 'fit' ? method : METHOD_SETTING.default,
    jDecimals: numberSetting(get, NUMBER_SETTINGS.jDecimals),
  };
}
