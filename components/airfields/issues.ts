// Zod issues to the first message per field path ("shelters.0.name"), the same keys the API sends.
export function issuesByField(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) {
    const k = i.path.map(String).join('.') || '(body)';
    out[k] ??= i.message;
  }
  return out;
}
