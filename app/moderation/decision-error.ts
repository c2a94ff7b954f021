import { AppError } from "~/utils/errors";

/** An expected refusal of a moderation step, with the HTTP status it answers. */
export class DecisionError extends AppError {
  constructor(
    message: string,
    readonly status: 400 | 403 | 404 | 409,
  ) {
    super(message, status);
  }
}
