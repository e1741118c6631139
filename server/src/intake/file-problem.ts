/** A problem that names where in the file it is (a band, a key); the file is refused whole. */
export class FileProblem extends Error {
  constructor(
    readonly where: string | null,
    problem: string,
    /** Every problem found, when there are several (a table's bad rows). */
    readonly all: { where: string | null; problem: string }[] = [{ where, problem }],
  ) {
    super(problem);
  }
}
