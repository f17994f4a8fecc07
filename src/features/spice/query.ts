import { z } from 'zod';
import { SCHEME_IDS } from '../../engine/scheme-ids';

/** Query of `GET /api/v1/specs/{id}/netlist`: which scheme, at which input voltage. */
export const specNetlistQuerySchema = z.strictObject({
  scheme: z.enum(SCHEME_IDS, { error: `scheme must be one of ${SCHEME_IDS.join(', ')}` }).describe('reset scheme id'),
  vin: z.enum(['min', 'nom', 'max'], { error: 'vin must be min, nom or max' }).default('nom').describe('input voltage of the operating point; default nom'),
});

/** Query of the candidate netlist: only the input voltage (the scheme is the candidate's). */
export const candidateNetlistQuerySchema = specNetlistQuerySchema.pick({ vin: true });

/** Reads URL search parameters into a plain object for a zod schema (last value wins). */
export function queryObject(url: URL): Record<string, string> {
  return Object.fromEntries(url.searchParams.entries());
}

/** File name for a download: letters, digits and dashes only. */
export function netlistFilename(name: string, scheme: string, vin: string): string {
  const slug = name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'spec';
  return `${slug}-${scheme}-vin-${vin}.cir`;
}
