import { mixingSequence } from '../../core/compound/sequence.ts';
import type { OrderLine } from '../../core/order.ts';
import type { Policy } from '../../core/policy.ts';
import type { PrintSequenceStep } from './options.ts';

/**
 * The suggested mixing sequence of an order's lines, from the policy's compounding section (the
 * sheet prints it); none when the policy has no compounding section.
 */
export function sheetSequence(lines: readonly OrderLine[], policy: Policy): PrintSequenceStep[] | undefined {
  return policy.compounding ? mixingSequence(lines, policy.compounding.mixingSequence) : undefined;
}
