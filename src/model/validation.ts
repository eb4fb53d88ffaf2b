/**
 * Agreement of the satellite estimates with field measurements. A field sample is matched to the
 * body's satellite median of the month that contains its date; when that month has no value, to
 * the month before or after if the date lies within validation.qualityWindowDays of that month.
 * Per parameter: n, bias, MAE, RMSE, R² and the least-squares line of satellite on field, and on a
 * ratio scale the median symmetric accuracy and signed bias (Morley et al. 2018) with the log10 bias
 * and R². This is not a same-day match-up: the inputs hold monthly medians, not scenes with dates,
 * so a one-day field sample meets a month's median; the page says so.
 */
import type { BulletinInputs, QualityParameter } from '../ingest/index.ts';
import { QUALITY_PARAMETERS } from '../ingest/index.ts';
import { agreement, logAgreement, type AgreementResult, type LogAgreementResult } from '../stats/index.ts';
import { parameterMonths } from './quality.ts';

export interface ValidationSummary {
  parameter: QualityParameter;
  /** The unit both sides are in (µg/L; for turbidity the satellite table's NTU or FNU). */
  unit: string;
  windowDays: number;
  pairs: Array<{ bodyId: string; date: string; field: number; satellite: number; satelliteMonth: number }>;
  /** Null where a measure is undefined (too few pairs, no spread): null is the model's only "no value". */
  agreement: Nullable<AgreementResult>;
  /** The same pairs on a ratio scale (Morley et al. 2018; log10 bias and R²): these values are close to log-normal. */
  logAgreement: Nullable<LogAgreementResult>;
}

/** The same record with every number that is not finite as null. */
type Nullable<T> = { [K in keyof T]: T[K] extends number ? number | null : T[K] };
const nullable = <T extends object>(record: T): Nullable<T> =>
  Object.fromEntries(
    Object.entries(record).map(([key, value]) => [key, typeof value === 'number' && !Number.isFinite(value) ? null : value]),
  ) as Nullable<T>;

const DAY = 86_400_000;

export function validation(inputs: BulletinInputs): ValidationSummary[] {
  if (!inputs.quality || inputs.field.length === 0) return [];
  const windowDays = inputs.config.validation.qualityWindowDays;
  return QUALITY_PARAMETERS.flatMap((parameter) => {
    // Turbidity in NTU is never compared with turbidity in FNU (ingest warns of the samples left out).
    const satelliteUnit = inputs.quality?.turbidityUnit ?? null;
    const samples = inputs.field.filter(
      (record) => record.parameter === parameter && (parameter !== 'turbidity' || record.turbidityUnit === satelliteUnit),
    );
    if (samples.length === 0) return [];
    const data = parameterMonths(inputs, parameter);
    const valueAt = (body: number, month: number) => {
      const slot = month - data.firstMonth;
      return slot >= 0 && slot < data.months ? ((data.values[body] as Float64Array)[slot] as number) : Number.NaN;
    };
    const pairs: ValidationSummary['pairs'] = [];
    for (const sample of samples) {
      const date = new Date(sample.day * DAY);
      const monthStart = Date.UTC(date.getUTCFullYear(), date.getUTCMonth(), 1) / DAY;
      const nextStart = Date.UTC(date.getUTCFullYear(), date.getUTCMonth() + 1, 1) / DAY;
      const candidates = [sample.month];
      if (sample.day - monthStart < windowDays) candidates.push(sample.month - 1);
      if (nextStart - 1 - sample.day < windowDays) candidates.push(sample.month + 1);
      const month = candidates.find((candidate) => Number.isFinite(valueAt(sample.body, candidate)));
      if (month === undefined) continue;
      pairs.push({
        bodyId: sample.bodyId,
        date: date.toISOString().slice(0, 10),
        field: sample.value,
        satellite: valueAt(sample.body, month),
        satelliteMonth: month,
      });
    }
    return [
      {
        parameter,
        unit: parameter === 'chlorophyll_a' ? 'µg/L' : (satelliteUnit as string),
        windowDays,
        pairs,
        agreement: nullable(
          agreement(
            pairs.map((pair) => pair.field),
            pairs.map((pair) => pair.satellite),
          ),
        ),
        logAgreement: nullable(
          logAgreement(
            pairs.map((pair) => pair.field),
            pairs.map((pair) => pair.satellite),
          ),
        ),
      },
    ];
  });
}
