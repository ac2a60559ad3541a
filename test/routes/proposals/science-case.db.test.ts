/** The PDF science case: upload checked by content and size, download only for the team. */
import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { proposalDocuments } from "~/db/schema/proposals";
import { loader as documentLoader } from "~/routes/proposals/science-case";
import { MAX_PDF_BYTES, makeTinyPdf } from "~/services/proposals/pdf";
import { MAX_UPLOAD_BODY_BYTES } from "~/services/proposals/upload.server";
import * as fx from "./fixture";

fx.useProposalWorld();

describe("the PDF science case", () => {
  it("stores a real PDF and serves it only to the team, as an attachment", async () => {
    const id = await fx.newDraft("ines", "PDF check");
    await fx.editor(id, "ines", { intent: "add-member", email: fx.people.tomasz });
    const pdf = makeTinyPdf(["PDF check", "science case"]);
    const up = await fx.upload(id, "ines", pdf, "../../etc/My Case.PDF", "text/plain");
    expect(up.status).toBe(302);
    const [doc] = await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id));
    expect(doc).toMatchObject({ filename: "My Case.PDF", contentType: "application/pdf", sizeBytes: pdf.length });
    expect(doc.sha256).toMatch(/^[0-9a-f]{64}$/);
    for (const who of ["ines", "tomasz"]) {
      const res = await fx.run(() =>
        documentLoader(fx.get(`/proposals/${id}/science-case`, who, { proposalId: String(id) })),
      );
      expect(res.status).toBe(200);
      expect(res.headers!.get("Content-Type")).toBe("application/pdf");
      expect(res.headers!.get("Content-Disposition")).toMatch(/^attachment; filename="My Case\.PDF"/);
      expect(res.headers!.get("X-Content-Type-Options")).toBe("nosniff");
      expect(Buffer.from(res.body!).equals(Buffer.from(pdf))).toBe(true);
    }
    expect(
      (await fx.run(() => documentLoader(fx.get(`/proposals/${id}/science-case`, "amara", { proposalId: String(id) }))))
        .status,
    ).toBe(404);
    expect(
      (await fx.run(() => documentLoader(fx.get(`/proposals/${id}/science-case`, null, { proposalId: String(id) }))))
        .location,
    ).toMatch(/^\/sign-in/);
  });

  it("refuses a PNG renamed .pdf by its content, with a clear message, and keeps the old file", async () => {
    const id = await fx.newDraft("ines", "PNG check");
    await fx.upload(id, "ines", makeTinyPdf(["original"]), "original.pdf");
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(500).fill(7)]);
    const out = await fx.upload(id, "ines", png, "figure.pdf", "application/pdf");
    expect(out.status).toBe(400);
    expect(out.data.errors.document).toMatch(/^Science case: The file is not a PDF/);
    const [doc] = await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id));
    expect(doc.filename).toBe("original.pdf");
  });

  it("refuses a file over 10 MB with 413 and stores nothing", async () => {
    const id = await fx.newDraft("ines", "Big check");
    const big = new Uint8Array(MAX_PDF_BYTES + 1);
    big.set(Buffer.from("%PDF-1.7\n"));
    big.set(Buffer.from("%%EOF\n"), big.length - 6);
    const out = await fx.upload(id, "ines", big, "big.pdf");
    expect(out.status).toBe(413);
    expect(out.data.errors.document).toMatch(/larger than the 10\.0 MB limit/);
    expect(await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id))).toEqual([]);
  });

  it("stops reading a body without a length as soon as it passes the cap", async () => {
    const id = await fx.newDraft("ines", "Stream check");
    const chunk = new Uint8Array(1024 * 1024).fill(0x41);
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled >= 50 * chunk.length) return controller.close();
        pulled += chunk.length;
        controller.enqueue(chunk);
      },
    });
    const out = await fx.rawPost(id, "ines", {
      body,
      duplex: "half",
      headers: { "Content-Type": "multipart/form-data; boundary=----x" },
    });
    expect(out.status).toBe(413);
    // At most the cap plus the chunk in flight and one read ahead were pulled, not the 50 MB offered.
    expect(pulled).toBeLessThanOrEqual(MAX_UPLOAD_BODY_BYTES + 2 * chunk.length);
  });
});
