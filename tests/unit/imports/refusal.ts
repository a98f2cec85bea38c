import { AppError } from "@/lib/errors";

/** The AppError that `run` throws; fails the test if it throws nothing or another error. */
export function refusal(run: () => unknown): AppError {
  try {
    run();
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}
