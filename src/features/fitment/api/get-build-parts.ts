import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CategorySlug } from '../../../../shared/catalog';
import { PartsListResponseSchema } from '../../../../shared/schemas/parts';
import { api, toSearchParams } from '../../../lib/api-client';
import type { Bearing, FrameStock } from '../lib/build-parts';
import { fitmentKeys } from './keys';

// Sorted by number, the main range (product line 0) comes first, so a large catalogue still lists it within a page.
const list = (frameCode: string, category: CategorySlug, bearing: Bearing | undefined, signal?: AbortSignal) =>
  api(`/parts${toSearchParams({ frame: frameCode, category, bearing, sort: 'number', pageSize: 100 })}`, PartsListResponseSchema, { signal }).then((r) => r.items);

/** Everything a build on one frame can be made of: complete units and cartridges with the bearing, and both housings. */
export async function getBuildParts(frameCode: string, bearing: Bearing, signal?: AbortSignal): Promise<FrameStock> {
  const [units, cartridges, compressorHousings, turbineHousings] = await Promise.all([
    list(frameCode, 'turbochargers', bearing, signal),
    list(frameCode, 'cartridges', bearing, signal),
    // Housings carry no bearing: the same ones fit either cartridge.
    list(frameCode, 'compressor-housings', undefined, signal),
    list(frameCode, 'turbine-housings', undefined, signal),
  ]);
  return { units, cartridges, compressorHousings, turbineHousings };
}

export const buildPartsQueryOptions = (frameCode: string, bearing: Bearing) =>
  queryOptions({ queryKey: fitmentKeys.buildParts(frameCode, bearing), queryFn: ({ signal }) => getBuildParts(frameCode, bearing, signal) });

export const useBuildParts = (frameCode: string, bearing: Bearing) => useQuery(buildPartsQueryOptions(frameCode, bearing));
