"use client";

import { useState } from "react";
import type { FieldErrors } from "@/lib/errors";
import { ApiError } from "@/components/shared/api-client";

/** Runs a form action, keeping its field errors and message for the form to show. */
export function useFormSubmit() {
  const [fields, setFields] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [isBusy, setBusy] = useState(false);

  async function run(action: () => Promise<void>) {
    setBusy(true);
    setFields({});
    setMessage(null);
    try {
      await action();
    } catch (error) {
      if (error instanceof ApiError) {
        setFields(error.fields);
        setMessage(error.message);
      } else {
        setMessage(error instanceof Error ? error.message : "Something went wrong.");
      }
    } finally {
      setBusy(false);
    }
  }

  return { fields, message, setMessage, isBusy, run };
}

/** A form's text inputs by name. */
export function formValues(form: HTMLFormElement): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of new FormData(form)) if (typeof value === "string") values[key] = value;
  return values;
}
