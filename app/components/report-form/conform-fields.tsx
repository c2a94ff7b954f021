// The form primitives bound to conform fields of the report form.
import { type FieldMetadata, getInputProps, getSelectProps } from "@conform-to/react";
import type { ComponentProps, InputHTMLAttributes } from "react";
import { Field, inputClass, RadioChoices, Select } from "~/components/field";

type AnyField = FieldMetadata<unknown, Record<string, unknown>, string[]>;

const initial = (field: AnyField) => (typeof field.initialValue === "string" ? field.initialValue : undefined);

export function TextField({
  label,
  field,
  ...rest
}: { label: string; field: AnyField } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <Field id={field.id} label={label} error={field.errors?.[0]}>
      {(control) => (
        <input
          {...getInputProps(field, { type: "text" })}
          {...rest}
          {...control}
          className={inputClass}
          autoComplete="off"
        />
      )}
    </Field>
  );
}

export function SelectField({
  field,
  ...rest
}: { field: AnyField } & Omit<ComponentProps<typeof Select>, "id" | "name" | "error" | "selectProps">) {
  return (
    <Select id={field.id} name={field.name} error={field.errors?.[0]} selectProps={getSelectProps(field)} {...rest} />
  );
}

export function RadioField({
  field,
  ...rest
}: { field: AnyField } & Omit<ComponentProps<typeof RadioChoices>, "id" | "name" | "error" | "defaultValue">) {
  return (
    <RadioChoices id={field.id} name={field.name} error={field.errors?.[0]} defaultValue={initial(field)} {...rest} />
  );
}
