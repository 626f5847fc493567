import type { Check } from '../findings.ts';
import { emptyBag, volumeOverflow, volumeShortfall } from './volumeOverflow.ts';
import { osmolarityPeripheral } from './osmolarityPeripheral.ts';
import { dextrosePeripheral } from './dextrosePeripheral.ts';
import { missingLabelOsmolarity } from './missingLabelOsmolarity.ts';
import { potassiumPeripheral } from './potassiumPeripheral.ts';
import { calciumPhosphate } from './calciumPhosphate.ts';
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
  calciumPhosphate,
  tnaStability,
  gir,
  doseRange,
  aluminum,
];
