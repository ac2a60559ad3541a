/**
 * The science case: one PDF per proposal, checked by content (pdf.ts), stored with its SHA-256 under
 * a safe file name, replaced or removed while the proposal is a draft; each version keeps its copy.
 */
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { proposalDocuments, proposalVersions } from "~/db/schema/proposals";
import { editDraft, type ProposalRef, ProposalRefusal } from "./lock.server";
import { checkPdf } from "./pdf";

export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** Keeps a file name readable and safe for a Content-Disposition header. */
export function cleanFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const cleaned = base
    .replace(/[^\w.\- ()]+/g, "_")
    .replace(/^\.+/, "")
    .trim()
    .slice(0, 120);
  const withName = cleaned === "" ? "science-case" : cleaned;
  return /\.pdf$/i.test(withName) ? withName : `${withName}.pdf`;
}

/** Stores (or replaces) the science case after checking by content that it is a PDF. */
export async function uploadScienceCase(
  db: Database,
  { file, ...ref }: ProposalRef & { file: { filename: string; bytes: Uint8Array } },
) {
  const check = checkPdf(file.bytes);
  if (!check.ok) throw new ProposalRefusal(400, `Science case: ${check.reason}`, "document");
  return editDraft(db, ref, async ({ tx, now, proposalId }) => {
    const row = {
      filename: cleanFilename(file.filename),
      contentType: "application/pdf",
      sizeBytes: file.bytes.length,
      sha256: sha256Hex(file.bytes),
      data: Buffer.from(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength),
      uploadedById: ref.viewer.user.id,
      uploadedAt: now,
    };
    await tx
      .insert(proposalDocuments)
      .values({ proposalId, ...row })
      .onConflictDoUpdate({ target: proposalDocuments.proposalId, set: row });
    return { filename: row.filename, sizeBytes: row.sizeBytes, sha256: row.sha256 };
  });
}

export async function removeScienceCase(db: Database, ref: ProposalRef) {
  return editDraft(db, ref, async ({ tx, proposalId }) => {
    await tx.delete(proposalDocuments).where(eq(proposalDocuments.proposalId, proposalId));
  });
}

/**
 * The science case bytes for someone allowed to see the proposal: the current one (version null),
 * or the one frozen with a version. Null when there is none.
 */
export async function readScienceCase(
  db: Database,
  { proposalId, version }: { proposalId: number; version: number | null },
) {
  if (version === null) {
    const [doc] = await db.select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, proposalId));
    return doc ? { filename: doc.filename, contentType: doc.contentType, data: doc.data, sha256: doc.sha256 } : null;
  }
  const [row] = await db
    .select()
    .from(proposalVersions)
    .where(and(eq(proposalVersions.proposalId, proposalId), eq(proposalVersions.version, version)));
  if (!row?.documentData) return null;
  const snap = row.snapshot as { document?: { filename?: string } | null };
  return {
    filename: snap.document?.filename ?? `science-case-v${version}.pdf`,
    contentType: "application/pdf",
    data: row.documentData,
    sha256: row.documentSha256 ?? sha256Hex(row.documentData),
  };
}
