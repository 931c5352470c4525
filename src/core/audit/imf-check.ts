import { resolveImf } from '../stars/imf-presets.js';

/**
 * Why an IMF name cannot be used in an audit, or undefined: a preset name or a custom power law
 * that the stellar code accepts (see resolveImf and makeImf for the limits of a custom IMF).
 */
export function imfProblem(name: string): string | undefined {
  try {
    resolveImf(name, 0);
    return undefined;
  } catch (e) {
    return (e as Error).message;
  }
}

export const isKnownImf = (name: string): boolean => imfProblem(name) === undefined;
