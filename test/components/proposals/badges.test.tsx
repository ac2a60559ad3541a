import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { STATUS_STYLE, StatusBadge } from "~/components/proposals/Badges";
import { PROPOSAL_STATUSES } from "~/db/schema/proposals";

describe("proposal status badges", () => {
  it("give every status a look of its own: no two share both colour and mark", () => {
    const looks = PROPOSAL_STATUSES.map((s) => `${STATUS_STYLE[s].tone}/${STATUS_STYLE[s].mark}`);
    expect(new Set(looks).size).toBe(PROPOSAL_STATUSES.length);
    // The two a reader confused: under review and not accepted differ in colour and in mark.
    expect(STATUS_STYLE.under_review.tone).not.toBe(STATUS_STYLE.declined.tone);
    expect(STATUS_STYLE.under_review.mark).not.toBe(STATUS_STYLE.declined.mark);
  });

  it("say the status in words, the mark hidden from screen readers", () => {
    const html = renderToStaticMarkup(<StatusBadge status="declined" label="Not accepted" />);
    expect(html).toContain('<span aria-hidden="true" class="mr-1 font-semibold">✕</span><span>Not accepted</span>');
  });
});
