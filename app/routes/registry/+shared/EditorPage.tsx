/**
 * The page of every registry editor, read as a namespace (`import * as Editor`, `<Editor.Page>`):
 * the title, the save form with its error summary, fields and save/cancel buttons, and on an edit
 * page the cards below it (delete, an instrument's bands). A refused post (`EditorState`, status
 * 400) shows its messages and keeps what was typed.
 */
import type { ReactNode } from "react";
import { Form, href, Link, useActionData, useNavigation } from "react-router";
import {
  Button,
  ButtonLink,
  buttonClass,
  Card,
  EmptyState,
  FormErrors,
  PageHeader,
  TextArea,
  TextField,
} from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";
import { sentence } from "~/lib/form-errors";
import type { EditorState } from "./editor.server";
import { type FieldSpec, labelsOf } from "./fields";

export type FormState = Partial<EditorState> | undefined | null;
export type Defaults = Record<string, string>;

/** The name, value (as typed, else the default) and message of one field. */
export function fieldProps(state: FormState, defaults: Defaults, name: string) {
  const message = state?.errors?.[name];
  return {
    name,
    defaultValue: state?.values?.[name] ?? defaults[name] ?? "",
    error: message ? sentence(message) : undefined,
  };
}

/** A saved record's values as the form's defaults, by field name. */
export const defaultsOf = (record: object, specs: FieldSpec[]): Defaults =>
  Object.fromEntries(specs.map((f) => [f.name, String((record as Record<string, unknown>)[f.name])]));

/** Text fields as their specs describe them. */
export function FieldList({ specs, state, defaults }: { specs: FieldSpec[]; state: FormState; defaults: Defaults }) {
  return specs.map((spec) => {
    const props = { label: spec.label, hint: spec.hint, ...fieldProps(state, defaults, spec.name) };
    const field = spec.multiline ? (
      <TextArea key={spec.name} {...props} />
    ) : (
      <TextField
        key={spec.name}
        unit={spec.unit}
        inputMode={spec.inputMode}
        list={spec.list}
        required
        autoComplete={spec.noAutofill ? "off" : undefined}
        {...props}
      />
    );
    return spec.wide ? (
      <div key={spec.name} className="sm:col-span-2">
        {field}
      </div>
    ) : (
      field
    );
  });
}

function summary(state: FormState, labels: Record<string, string>): string[] {
  return Object.entries(state?.errors ?? {}).map(([key, message]) =>
    labels[key] ? `${labels[key]}: ${message}` : sentence(message),
  );
}

/** The props of an editor serving a new and an edit page: either page's loader data, a refused post. */
export type Props<N extends { loaderData: unknown }, E extends { loaderData: unknown }> = {
  loaderData: N["loaderData"] | E["loaderData"];
  actionData?: EditorState;
};

type EditorPageProps = {
  /** What the page edits, as its labels say it: "station". */
  noun: string;
  /** The name of the record being edited; null on the new page. */
  editing: string | null;
  /** Heading and form name when not "New {noun}" / "Edit {noun} {name}". */
  label?: string;
  /** A heading other than the label. */
  title?: string;
  lead?: string;
  state: FormState;
  fields: FieldSpec[];
  cancelTo: string;
  /** The form's fields. */
  children: ReactNode;
  /** Cards below the form (an edit page's delete card). */
  below?: ReactNode;
};

/** The editor's page: header, the save form in a card ("Add …" or "Save …"), and the cards below it. */
export function Page({ noun, editing, label, title, lead, state, fields, cancelTo, children, below }: EditorPageProps) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" && navigation.formData?.get("intent") === "save";
  const name = label ?? (editing === null ? `New ${noun}` : `Edit ${noun} ${editing}`);
  const form = (
    <Card>
      <Form method="post" noValidate aria-label={name} className="space-y-5">
        <input type="hidden" name="intent" value="save" />
        <FormErrors errors={summary(state, labelsOf(fields))} />
        {children}
        <div className="flex flex-wrap gap-3">
          <Button type="submit" disabled={busy}>
            {busy ? "Saving…" : `${editing === null ? "Add" : "Save"} ${noun}`}
          </Button>
          <Link to={cancelTo} className={buttonClass("secondary")}>
            Cancel
          </Link>
        </div>
      </Form>
    </Card>
  );
  return (
    <>
      <PageHeader title={title ?? name} lead={lead} />
      {below ? (
        <div className="grid grid-cols-1 gap-6">
          {form}
          {below}
        </div>
      ) : (
        form
      )}
    </>
  );
}

/**
 * A card with a delete button that asks first: a dialog says what goes, with the form that deletes
 * (and optional extra fields, e.g. a name to type). The action refuses a delete without `confirm=yes`.
 */
export function DeleteCard({
  title,
  children,
  buttonLabel,
  fields,
}: {
  title: string;
  children: ReactNode;
  buttonLabel: string;
  fields?: ReactNode;
}) {
  const actionData = useActionData();
  return (
    <Card title={title} className="ring-danger-700/30">
      <div className="space-y-3">
        <div className="text-sm text-night-700">{children}</div>
        <ConfirmDialog
          label={buttonLabel}
          title={`${title}?`}
          intent="delete"
          confirmLabel={`Yes, ${buttonLabel.charAt(0).toLowerCase()}${buttonLabel.slice(1)}`}
          variant="danger"
          fields={fields}
          closeOn={actionData}
        >
          It goes for good: this cannot be undone.
        </ConfirmDialog>
      </div>
    </Card>
  );
}

/** A new page for a record of a site when there is no site yet. */
export function NoSiteYet({ title, children }: { title: string; children: ReactNode }) {
  return (
    <>
      <PageHeader title={title} />
      <EmptyState
        title="Add the site first"
        action={<ButtonLink to={href("/registry/sites/new")}>Add a site</ButtonLink>}
      >
        {children}
      </EmptyState>
    </>
  );
}

/** A registry page's meta: "{what} — Array registry — Fringe Docket". */
export const meta = (what: string) => [{ title: `${what} — Array registry — Fringe Docket` }];
