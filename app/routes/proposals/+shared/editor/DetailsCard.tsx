/** The proposal's text: title, abstract, science category and band, saved a second after each change. */
import { useEffect, useRef, useState } from "react";
import { Form, useFetcher } from "react-router";
import { Button, Card, cx, SelectField, TextArea, TextField } from "~/components/ui";
import { countWords } from "~/services/proposals/words";
import { bind } from "../bind";
import { Choices } from "../Choices";
import { ProposalFacts } from "../ProposalFacts";
import { shownUtc } from "../utc";
import type { ActionResult } from "./result";

export type DetailsCardProps = {
  proposal: {
    id: number;
    title: string;
    abstract: string;
    scienceCategory: string;
    bandId: number | null;
    updatedAt: string;
  };
  bands: { id: number; label: string }[];
  categories: string[];
  limits: { titleMaxChars: number; abstractMaxWords: number };
  cycleName: string;
  editable: boolean;
  result?: ActionResult;
};

/** Posts the form as "autosave" a second after the last change; answers with the time saved. */
function useAutosave(proposalId: number) {
  const fetcher = useFetcher<ActionResult>({ key: `autosave-${proposalId}` });
  const formRef = useRef<HTMLFormElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const [dirty, setDirty] = useState(false);

  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  useEffect(() => {
    if (fetcher.state === "idle" && fetcher.data?.savedAt) setDirty(false);
  }, [fetcher.state, fetcher.data]);

  function schedule() {
    setDirty(true);
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      const el = formRef.current;
      if (!el) return;
      const fd = new FormData(el);
      fd.set("intent", "autosave");
      void fetcher.submit(fd, { method: "post" });
    }, 1000);
  }
  return { fetcher, formRef, dirty, schedule };
}

export function DetailsCard(props: DetailsCardProps) {
  const { proposal, bands, categories, limits, cycleName, result } = props;
  const { fetcher, formRef, dirty, schedule } = useAutosave(proposal.id);
  const shown = result?.values ?? {
    title: proposal.title,
    abstract: proposal.abstract,
    scienceCategory: proposal.scienceCategory,
    bandId: proposal.bandId === null ? "" : String(proposal.bandId),
  };
  const [words, setWords] = useState(() => countWords(shown.abstract ?? ""));
  const errors: Record<string, string | undefined> = fetcher.data ? fetcher.data.errors : (result?.errors ?? {});
  const autosaveErrors =
    fetcher.data && Object.keys(fetcher.data.errors).length > 0 ? Object.values(fetcher.data.errors) : null;

  let status: string;
  if (fetcher.state !== "idle") status = "Saving…";
  else if (autosaveErrors) status = "Not saved: fix the field marked below.";
  else if (dirty) status = "Unsaved changes";
  else if (fetcher.data?.savedAt)
    // The same clock as every other time of the app: UTC, 24-hour, the zone shown.
    status = `Saved ${shownUtc(fetcher.data.savedAt)}`;
  else status = `Last change ${shownUtc(proposal.updatedAt)}`;

  if (!props.editable) {
    return (
      <ProposalFacts
        category={proposal.scienceCategory}
        band={bands.find((b) => b.id === proposal.bandId)?.label ?? null}
        abstract={proposal.abstract}
        abstractTerm={`Abstract (${countWords(proposal.abstract)} words)`}
      />
    );
  }

  return (
    <Card
      title="Proposal"
      actions={
        <span
          role="status"
          aria-live="polite"
          className={cx("text-sm", autosaveErrors ? "font-medium text-danger-700" : "text-night-600")}
          data-testid="autosave-status"
        >
          {status}
        </span>
      }
    >
      <Form
        method="post"
        ref={formRef}
        className="grid gap-4"
        onChange={schedule}
        noValidate
        aria-label="Proposal text"
      >
        <TextField label="Title" {...bind("title", shown, errors)} maxLength={limits.titleMaxChars} />
        <div className="space-y-1">
          <TextArea
            label="Abstract"
            {...bind("abstract", shown, errors)}
            rows={8}
            onChange={(e) => setWords(countWords(e.currentTarget.value))}
            hint={`What you will measure and why the array is needed. At most ${limits.abstractMaxWords} words.`}
          />
          <p
            className={cx(
              "num text-right text-sm",
              words > limits.abstractMaxWords ? "font-semibold text-danger-700" : "text-night-600",
            )}
            aria-live="polite"
          >
            {words} / {limits.abstractMaxWords} words
          </p>
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField label="Science category" {...bind("scienceCategory", shown, errors)}>
            <Choices items={categories.map((c) => ({ value: c, label: c }))} />
          </SelectField>
          <SelectField label="Instrument and band" {...bind("bandId", shown, errors)}>
            <Choices items={bands.map((b) => ({ value: b.id, label: b.label }))} />
          </SelectField>
        </div>
        <p className="text-sm text-night-600">Cycle: {cycleName} (fixed once the proposal exists).</p>
        <div>
          <Button type="submit" name="intent" value="save" variant="secondary">
            Save now
          </Button>
        </div>
      </Form>
    </Card>
  );
}
