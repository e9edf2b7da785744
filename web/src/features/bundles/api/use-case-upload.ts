import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { caseBundlesQueryOptions } from './get-case-bundles';

/**
 * A case upload with its progress (0..1) that refreshes the case's bundle list either way; the
 * bundle and the recording uploads differ only in what they send.
 */
export function useCaseUpload<Input, Answer>(
  caseId: string,
  send: (caseId: string, input: Input, onProgress: (share: number) => void) => Promise<Answer>,
) {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (input: Input) => {
      setProgress(0);
      return send(caseId, input, setProgress);
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: caseBundlesQueryOptions(caseId).queryKey }),
  });
  return { ...mutation, progress };
}
