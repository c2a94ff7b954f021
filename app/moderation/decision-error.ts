/** An expected refusal of a moderation step, with the HTTP status it answers. */
export class DecisionError extends Error {
  constructor(message: string, readonly status: 400 | 403 | 404 | 409) {
    super(message);
  }
}
