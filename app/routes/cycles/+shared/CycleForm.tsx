import type { ReactNode } from "react";
import { Form } from "react-router";
import { Card, FormErrors, PageHeader, TextField } from "~/components/ui";
import { FieldList, type FieldSpec, GroupError, SubmitButton } from "~/components/ui/FieldList";
import type { ConfigurationChoice } from "~/services/cycles/configurations.server";
import type { CycleFormValues } from "~/services/cycles/form";

const CYCLE_FIELDS: FieldSpec[] = [
  { name: "name", label: "Name", maxLength: 40, required: true, placeholder: "2027B" },
  { name: "submissionDeadline", label: "Submission deadline", unit: "UTC", type: "datetime-local", required: true },
  {
    name: "observingStart",
    label: "First night",
    type: "date",
    required: true,
    hint: "The night that begins on the evening of this date.",
  },
  { name: "observingEnd", label: "Last night", type: "date", required: true },
  { name: "description", label: "Description", multiline: true, maxLength: 500, wrapClassName: "md:col-span-2" },
];

const COMMITTEE_FIELDS: FieldSpec[] = [
  {
    name: "reviewDeadline",
    label: "Review deadline",
    unit: "UTC",
    type: "datetime-local",
    hint: "Reviews are submitted before it; the chair may reopen scoring later.",
  },
  { name: "decisionDate", label: "Decision date", type: "date", hint: "When the teams should hear the outcome." },
  { name: "scoreBest", label: "Best score", inputMode: "numeric", required: true, hint: "Default 1 (best)." },
  { name: "scoreWorst", label: "Poorest score", inputMode: "numeric", required: true, hint: "Default 5 (poorest)." },
];

/** A labelled checkbox of a multiple choice, ticked when its value is among those the form holds. */
function Tick({
  name,
  value,
  ticked,
  className,
  children,
}: {
  name: string;
  value: number;
  ticked: string[];
  className: string;
  children: ReactNode;
}) {
  return (
    <label className={className}>
      <input
        type="checkbox"
        name={name}
        value={value}
        defaultChecked={ticked.includes(String(value))}
        className="mt-1 h-4 w-4 accent-ember-700"
      />
      <span>{children}</span>
    </label>
  );
}

/** A person who may sit on the committee, ticked when on it. */
function MemberRow({ reviewer, values }: { reviewer: ReviewerChoice; values: CycleFormValues }) {
  return (
    <li className="py-2">
      <Tick name="committee" value={reviewer.id} ticked={values.committee} className="flex items-start gap-2">
        <span className="font-medium">{reviewer.name}</span>{" "}
        <span className="text-sm text-night-600">{reviewer.institute}</span>
      </Tick>
    </li>
  );
}

/** A configuration that may be offered, with its nights. */
function OfferRow({
  choice,
  values,
  errors,
}: { choice: ConfigurationChoice } & Pick<CycleFormProps, "values" | "errors">) {
  const nights = `nights-${choice.id}`;
  return (
    <li className="flex flex-wrap items-center gap-4 py-3">
      <Tick name="offered" value={choice.id} ticked={values.offered} className="flex min-w-56 flex-1 items-start gap-2">
        <span className="font-medium">{choice.name}</span>{" "}
        <span className="text-sm text-night-600">({choice.stations} stations)</span>
        <span className="block text-sm text-night-600">{choice.description}</span>
      </Tick>
      {/* Wide enough for "Nights for extended-6 (nights)" on one line: a name never breaks at its hyphen. */}
      <div className="w-full sm:w-64">
        <TextField
          label={`Nights for ${choice.name}`}
          name={nights}
          inputMode="decimal"
          defaultValue={values.nights[choice.id] ?? ""}
          error={errors[nights]}
          unit="nights"
        />
      </div>
    </li>
  );
}

export type ReviewerChoice = { id: number; name: string; institute: string };

type CycleFormProps = {
  values: CycleFormValues;
  errors: Record<string, string>;
  configurations: ConfigurationChoice[];
  reviewers: ReviewerChoice[];
};

/** The chair's form for a cycle: dates, deadline and the configurations on offer with their nights. */
export function CycleForm({
  values,
  errors,
  configurations,
  reviewers,
  submitLabel,
}: CycleFormProps & { submitLabel: string }) {
  return (
    <Form method="post" className="grid gap-6" noValidate>
      <FormErrors errors={Object.values(errors)} />
      <Card title="The cycle">
        <div className="grid gap-4 md:grid-cols-2">
          <FieldList fields={CYCLE_FIELDS} values={values} errors={errors} />
        </div>
      </Card>
      <Card title="Configurations on offer">
        <GroupError message={errors.offered} className="mb-2" />
        <ul className="divide-y divide-night-100">
          {configurations.map((c) => (
            <OfferRow key={c.id} choice={c} values={values} errors={errors} />
          ))}
        </ul>
      </Card>
      <Card title="The committee">
        <div className="grid gap-4 md:grid-cols-2">
          <FieldList fields={COMMITTEE_FIELDS} values={values} errors={errors} />
        </div>
        <h3 className="mt-5 text-sm font-semibold text-night-800">Members</h3>
        <GroupError message={errors.committee} className="mt-1" />
        {reviewers.length === 0 ? (
          <p className="text-sm text-night-600">Nobody holds the reviewer role yet (People, for administrators).</p>
        ) : (
          <ul className="grid divide-y divide-night-100 sm:grid-cols-2 sm:divide-y-0">
            {reviewers.map((r) => (
              <MemberRow key={r.id} reviewer={r} values={values} />
            ))}
          </ul>
        )}
      </Card>
      <div>
        <SubmitButton label={submitLabel} />
      </div>
    </Form>
  );
}

/**
 * The page of the cycle editor, for a new cycle and an existing one: what the loader gave, or what
 * the chair typed when the action refused it.
 */
export function CycleEditor({
  title,
  submitLabel,
  page,
  retry,
}: {
  title: string;
  submitLabel: string;
  page: { values: CycleFormValues; configurations: ConfigurationChoice[]; reviewers: ReviewerChoice[] };
  retry: { values: CycleFormValues; errors: Record<string, string> } | undefined;
}) {
  return (
    <>
      <PageHeader title={title} lead="Dates are nights at the site; the deadlines are in UTC." />
      <CycleForm
        values={retry?.values ?? page.values}
        errors={retry?.errors ?? {}}
        configurations={page.configurations}
        reviewers={page.reviewers}
        submitLabel={submitLabel}
      />
    </>
  );
}
