// The public check's answers, serialised, per digest: an issued certificate never changes; only
// whether it is the current revision does, when a revision supersedes it, and that clears this
// in every process (referenceData.ts, "certificates"). Unknown digests are not kept.

const MAX_ANSWERS = 1000;
// kept as bytes, so a repeat answer is sent without encoding its text again
const answers = new Map<string, Buffer>();

export const cachedVerification = (key: string): Buffer | undefined => answers.get(key);

export function rememberVerification(key: string, json: Buffer): void {
  if (answers.size >= MAX_ANSWERS) answers.delete(answers.keys().next().value!); // oldest first
  answers.set(key, json);
}

export const invalidateVerifications = (): void => answers.clear();
