// Report fields shown as information only.
import type { Report } from '../core/report.ts';

export type PredictedOsmolality = NonNullable<Report['information']['predictedOsmolality']>;

/** `information.predictedOsmolality`, when the report carries estimates. */
export function predictedOsmolality(report: Report): PredictedOsmolality | null {
  const p = report.information.predictedOsmolality;
  return p && p.estimates.length > 0 ? p : null;
}
