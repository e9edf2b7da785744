/**
 * Driftcase's own review vocabulary (../shared/notes/design.md, "Words"): an investigator submits
 * findings for sign-off; a reviewer returns them with comments or signs them off. One place, so
 * the buttons, dialogs, history and case status all say the same thing.
 */
export const REVIEW_WORDS = {
  signOff: 'Sign off',
  signOffTitle: (version: number) => `Sign off findings version ${version}`,
  signOffButton: (version: number) => `Sign off version ${version}`,
  returnWithComments: 'Return with comments',
  returnTitle: (version: number) => `Return version ${version} with comments`,
  returnButton: 'Return to the author',
  returnedStatus: 'Returned with comments',
  commentsLabel: 'Comments for the author',
} as const;
