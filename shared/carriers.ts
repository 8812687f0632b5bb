import { z } from 'zod';

/**
 * Where each carrier shows a consignment, as a URL pattern with `{tracking}` for the tracking number. The carriers
 * and their sites are invented (reserved .example domains); a deployment sets its own through CARRIER_TRACKING_URLS
 * (server/env.ts). A carrier without a pattern, like a customer collecting, shows its number without a link.
 */
export const DEFAULT_TRACKING_URLS: Readonly<Record<string, string>> = {
  'Cobbleline Freight': 'https://track.cobbleline.example/consignment/{tracking}',
  'Tern Parcel': 'https://www.ternparcel.example/track?parcel={tracking}',
  'Nightjar Overnight': 'https://nightjar-overnight.example/where-is/{tracking}',
};

export const TrackingUrlPatternsSchema = z.record(
  z.string().min(1),
  z
    .string()
    .regex(/^https:\/\/[^\s{}]+\{tracking\}[^\s{}]*$|^https:\/\/[^\s{}]*\{tracking\}$/, 'each pattern is an https address with {tracking} in it'),
);
export type TrackingUrlPatterns = z.infer<typeof TrackingUrlPatternsSchema>;

/** The carrier's page for a tracking number, or null when the carrier has no pattern. */
export function trackingUrl(patterns: TrackingUrlPatterns, carrier: string | null, trackingNumber: string | null): string | null {
  if (!carrier || !trackingNumber) return null;
  const pattern = patterns[carrier];
  return pattern ? pattern.replace('{tracking}', encodeURIComponent(trackingNumber)) : null;
}
