import { queryOptions, useQuery } from '@tanstack/react-query';
import { manufacturerSchema, type Manufacturer } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { vendorPartKeys } from './vendor-part-keys';

const manufacturersSchema = manufacturerSchema.array();

export function getManufacturers(signal?: AbortSignal): Promise<Manufacturer[]> {
  return apiRequest('/manufacturers', { schema: manufacturersSchema, signal });
}

export const manufacturersQueryOptions = () =>
  queryOptions({ queryKey: vendorPartKeys.manufacturers(), queryFn: ({ signal }) => getManufacturers(signal), staleTime: 5 * 60_000 });

export function useManufacturers() {
  return useQuery(manufacturersQueryOptions());
}
