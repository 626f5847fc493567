import type { Check } from '../findings.ts';
import { emptyBag, volumeOverflow, volumeShortfall } from './volumeOverflow.ts';
import { osmolarityPeripheral } from './osmolarityPeripheral.ts';
import { dextrosePeripheral } from './dextrosePeripheral.ts';
import { missingLabelOsmolarity } from './missingLabelOsmolarity.ts';

/** Every release check, in the order their findings are listed. Add a check here. */
export const CHECKS: readonly Check[] = [
  emptyBag,
  volumeOverflow,
  volumeShortfall,
  osmolarityPeripheral,
  dextrosePeripheral,
  missingLabelOsmolarity,
];
