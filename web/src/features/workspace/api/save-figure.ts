import { ZStoreFigureResponse } from '@shared/contracts/figures';
import { shortHash } from '@shared/evidence-names';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { ApiError } from '@web/lib/api-client';
import { sendFormWithProgress, uploadAnswerError } from '@web/lib/send-form-with-progress';
import type { Picture } from '../lib/make-picture';

/** Sends a made picture as multipart field `figure`, with its caption and moment. */
export async function saveFigure(caseId: string, picture: Picture) {
  const form = new FormData();
  form.append('caption', picture.caption);
  form.append('replayId', picture.moment.replayId);
  form.append('step', String(picture.moment.step));
  form.append('figure', picture.blob, picture.fileName);
  // A picture is small: its upload progress is not worth showing.
  const { status, payload } = await sendFormWithProgress(apiPaths.caseFigures(caseId), form, () => {});
  if (status !== 200 && status !== 201) throw uploadAnswerError(status, payload);
  const parsed = ZStoreFigureResponse.safeParse(payload);
  if (!parsed.success)
    throw new ApiError(status, 'unexpected_response', 'The answer has an unexpected shape.');
  return parsed.data;
}

/**
 * Saves a picture to the case and says so in plain words; refreshes the case's work, so the
 * findings form can cite the new figure at once.
 */
export function useSaveFigure(caseId: string) {
  const queryClient = useQueryClient();
  const mutation = useMutation({
    mutationFn: (picture: Picture) => saveFigure(caseId, picture),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
  return async (picture: Picture) => {
    const { figure, duplicate } = await mutation.mutateAsync(picture);
    const hash = shortHash(figure.sha256);
    return duplicate
      ? `This picture is already a figure of the case (SHA-256 ${hash}).`
      : `Saved to the case as a figure (SHA-256 ${hash}); findings can now cite it.`;
  };
}
