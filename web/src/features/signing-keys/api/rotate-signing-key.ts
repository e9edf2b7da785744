import { type TKeyThumbprints, ZKeyThumbprints } from '@shared/contracts/keys';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { keyThumbprintsQueryOptions } from './get-key-thumbprints';

export function rotateSigningKey(): Promise<TKeyThumbprints> {
  return apiRequest(apiPaths.rotateSigningKey, { method: 'POST', body: {}, schema: ZKeyThumbprints });
}

/** Rotates the signing key; the answer is the new set of thumbprints, shown at once. */
export function useRotateSigningKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rotateSigningKey,
    onSuccess: (thumbprints) => queryClient.setQueryData(keyThumbprintsQueryOptions().queryKey, thumbprints),
  });
}
