/** A table that cannot be read or summarised; `row` (1-based, header = 1) and `column` locate it. */
export class SpacingError extends Error {
  constructor(
    message: string,
    public field?: string,
    public row?: number,
    public column?: string,
  ) {
    super(message);
    this.name = "SpacingError";
  }
}
