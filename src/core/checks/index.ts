import type { Check } from '../findings.ts';
import { emptyBag, volumeOverflow, volumeShortfall } from './volumeOverflow.ts';
import { osmolarityPeripheral } from './osmolarityPeripheral.ts';
import { dextrosePeripheral } from './dextrosePeripheral.ts';
import { missingLabelOsmolarity } from './missingLabelOsmolarity.ts';
import { potassiumPeripheral } from './potassiumPeripheral.ts';
import { calciumPhosphateProduct, calciumPhosphateScreens } from './calciumPhosphate.ts';
import { tnaStability } from './tnaStability.ts';
import { gir } from './gir.ts';
import { doseRange } from './doseRange.ts';
import { aluminum } from './aluminum.ts';

/** Every release check, in the order their findings are listed. Add a check here. */
export const CHECKS: readonly Check[] = [
  emptyBag,
  volumeOverflow,
  volumeShortfall,
  osmolarityPeripheral,
  dextrosePeripheral,
  missingLabelOsmolarity,
  potassiumPeripheral,
  calciumPhosphateProduct,
  calciumPhosphateScreens,
  tnaStability,
  gir,
  doseRange,
  aluminum,
];

/**
 * The checks that read the order's route. The others depend on the bag alone, which the route does not
 * change, so the solver's route re-check keeps their findings (a test holds every other check to that).
 */
export const ROUTE_CHECKS: ReadonlySet<Check> = new Set([osmolarityPeripheral, dextrosePeripheral, potassiumPeripheral, calciumPhosphateProduct]);
