/** A failure whose message is safe and useful to show the person who caused it. */
export class UserFacingError extends Error {
  constructor(
    message: string,
    readonly status: number = 400,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
    this.name = "UserFacingError";
  }
}
