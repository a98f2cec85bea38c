"use client";

import { useEffect, useRef, useState } from "react";
import { quantityEcho, type QuantitySpec } from "@/lib/workspace/quantity-field";
import { Field } from "@/components/shared/field";

type QuantityInputProps = Omit<React.ComponentProps<typeof Field>, "echo" | "defaultValue"> & {
  /** The field's reader; a function of the text for one input that feeds either of two fields (a length or an angle). */
  spec: QuantitySpec | ((text: string) => QuantitySpec);
  defaultValue?: string;
};

/**
 * A quantity's input: it takes a value with a unit ("4,100,000 Msun", "230 GHz") and shows beside
 * itself, as the user types, the value the server will store (or why it will refuse it), read by
 * the same reader as the server's schema. The form still sends the raw text.
 */
export function QuantityInput({ spec, defaultValue = "", ...field }: QuantityInputProps) {
  const [text, setText] = useState(defaultValue);
  const ref = useRef<HTMLDivElement>(null);
  // A form reset puts the input back to its default text; the echo follows it.
  useEffect(() => {
    const form = ref.current?.closest("form");
    const onReset = () => setText(defaultValue);
    form?.addEventListener("reset", onReset);
    return () => form?.removeEventListener("reset", onReset);
  }, [defaultValue]);
  const echo = quantityEcho(typeof spec === "function" ? spec(text) : spec, text);
  return (
    <div ref={ref} className={field.className}>
      <Field
        {...field}
        className={undefined}
        defaultValue={defaultValue}
        onChange={(event) => setText(event.target.value)}
        echo={echo === null ? null : echo.ok ? { text: echo.text, isRefused: false } : { text: echo.message, isRefused: true }}
      />
    </div>
  );
}
