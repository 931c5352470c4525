import type { CosmologyParams } from '../cosmology/params.js';
import { makeBbks } from './bbks.js';
import { makeEisensteinHu, makeEisensteinHuNoWiggle } from './eisenstein-hu.js';

/** The linear-power choices. A table is P(k) at z = 0 in Mpc³ against k in Mpc⁻¹ (no h). */
export type TransferSpec =
  | { readonly kind: 'eh98' }
  | { readonly kind: 'eh98-nowiggle' }
  | { readonly kind: 'bbks' }
  | { readonly kind: 'table'; readonly kMpc: readonly number[]; readonly pMpc3: readonly number[] }
  | { readonly kind: 'power-law'; readonly n: number; readonly amplitude: number };

export const TRANSFER_NAMES = ['eh98', 'eh98-nowiggle', 'bbks'] as const;
export type TransferName = (typeof TRANSFER_NAMES)[number];

export function makeTransfer(p: CosmologyParams, name: TransferName): (kMpc: number) => number {
  switch (name) {
    case 'eh98':
      return makeEisensteinHu(p);
    case 'eh98-nowiggle':
      return makeEisensteinHuNoWiggle(p);
    case 'bbks':
      return makeBbks(p);
  }
}
