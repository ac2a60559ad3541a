/** The science case: the PDF as it stands, an upload that checks the size before sending, a removal. */
import { type FormEvent, useState } from "react";
import { Form, href, useNavigation } from "react-router";
import { Button, Card } from "~/components/ui";
import { formatBytes } from "~/lib/format";
import { shownUtc } from "../utc";
import { IntentButton } from "./IntentButton";
import type { ActionResult } from "./result";

export type DocumentCardProps = {
  proposalId: number;
  document: { filename: string; size: string; sha256: string; uploadedAt: string; uploadedBy: string | null } | null;
  limits: { pdfBytes: number; pdfLabel: string };
  editable: boolean;
  result?: ActionResult;
};

/** The file input with its client-side check (present, not over the limit) and its message. */
function UploadForm({
  replacing,
  limits,
  serverError,
}: {
  replacing: boolean;
  limits: DocumentCardProps["limits"];
  serverError?: string;
}) {
  const [clientError, setClientError] = useState<string | null>(null);
  const navigation = useNavigation();
  const uploading = navigation.state === "submitting" && navigation.formEncType === "multipart/form-data";
  function check(e: FormEvent<HTMLFormElement>) {
    const input = e.currentTarget.elements.namedItem("document") as HTMLInputElement | null;
    const file = input?.files?.[0];
    if (!file) {
      e.preventDefault();
      setClientError("Science case: choose a PDF file to upload.");
    } else if (file.size > limits.pdfBytes) {
      e.preventDefault();
      setClientError(
        `Science case: the file is ${formatBytes(file.size)}; the limit is ${limits.pdfLabel}. Please upload a smaller PDF.`,
      );
    } else setClientError(null);
  }
  const error = clientError ?? serverError;
  return (
    <Form
      method="post"
      encType="multipart/form-data"
      onSubmit={check}
      className="grid gap-3"
      aria-label="Upload the science case"
    >
      <input type="hidden" name="intent" value="upload-document" />
      <div className="space-y-1">
        <label htmlFor="document" className="block text-sm font-medium text-night-800">
          {replacing ? "Replace with" : "PDF file"}
        </label>
        <input
          id="document"
          name="document"
          type="file"
          accept="application/pdf,.pdf"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? "document-error" : "document-hint"}
          className="block w-full text-sm file:mr-3 file:rounded-lg file:border-0 file:bg-night-100 file:px-3 file:py-2 file:font-medium file:text-night-800"
          onChange={() => setClientError(null)}
        />
        {error ? (
          <p id="document-error" role="alert" className="text-sm font-medium text-danger-700">
            {error}
          </p>
        ) : (
          <p id="document-hint" className="text-sm text-night-600">
            A PDF of at most {limits.pdfLabel}. It is checked by its content, not its name.
          </p>
        )}
      </div>
      <div>
        <Button type="submit" variant="secondary" disabled={uploading}>
          {uploading ? "Uploading…" : "Upload"}
        </Button>
      </div>
    </Form>
  );
}

export function DocumentCard({ proposalId, document, limits, editable, result }: DocumentCardProps) {
  return (
    <Card title="Science case (PDF)">
      {document ? (
        <div className="mb-3 text-sm">
          <a
            href={href("/proposals/:proposalId/science-case", { proposalId: String(proposalId) })}
            className="font-medium text-ember-800 underline"
            download
          >
            {document.filename}
          </a>{" "}
          <span className="text-night-600">
            · {document.size} · uploaded {shownUtc(document.uploadedAt)}
            {document.uploadedBy ? ` by ${document.uploadedBy}` : ""}
          </span>
          <p className="num mt-1 break-all text-xs text-night-500">SHA-256 {document.sha256}</p>
        </div>
      ) : (
        <p className="mb-3 text-sm text-night-600">No science case yet.</p>
      )}
      {editable ? (
        <>
          <UploadForm
            key={document?.sha256 ?? "none"}
            replacing={document !== null}
            limits={limits}
            serverError={result?.errors.document}
          />
          {document ? (
            <IntentButton intent="remove-document" formClassName="mt-2" size="sm" variant="ghost">
              Remove the PDF
            </IntentButton>
          ) : null}
        </>
      ) : null}
    </Card>
  );
}
