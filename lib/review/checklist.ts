// The silent-read checklist: what a wordless gag must do to read. Our own
// wording; the owner may add, reword and remove items per series.
export const DEFAULT_CHECKLIST = [
  'Each panel shows one clear action.',
  'The turn can be seen in panel 3.',
  'The character reads as a silhouette.',
  'Backgrounds stay quiet behind the character.',
  'The payoff is legible at printed size.',
  'Nothing important sits outside the safe area.',
  'Balloon rooms, if any, sit where the eye already travels.',
] as const;
