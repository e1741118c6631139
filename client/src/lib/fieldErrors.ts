/** The part of a zod error this app reads; keeps the client free of a direct zod import. */
interface IssueList {
  issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }>;
}

/** Field path ("districtId", "address.city") → its first problem, for field-level form errors. */
export function fieldErrorsFromZod(error: IssueList): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.');
    errors[key] ??= issue.message;
  }
  return errors;
}
