/** Reviews shown beside the proposal: the other reviewers' (anonymous) after one's own submission; all, with names, for the chair. */
import { Badge, Card } from "~/components/ui";

type Anonymous = { label: string; score: number | null; confidence: string | null; commentToCommittee: string };

export function OthersReviews({ reviews }: { reviews: Anonymous[] }) {
  return (
    <Card title="The other reviewers">
      {reviews.length === 0 ? (
        <p className="text-sm text-night-600">No other review has been submitted yet.</p>
      ) : (
        <ul className="grid gap-3 text-sm">
          {reviews.map((r) => (
            <li key={r.label}>
              <p className="font-medium">
                {r.label}: score {r.score ?? "—"}
                {r.confidence ? <span className="font-normal text-night-600"> · confidence {r.confidence}</span> : null}
              </p>
              <p className="whitespace-pre-wrap text-night-800">
                {r.commentToCommittee || "(no comment to the committee)"}
              </p>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

type Named = {
  reviewer: string;
  status: "active" | "declined";
  declineReason: string | null;
  score: number | null;
  confidence: string | null;
  commentToPi: string | null;
  commentToCommittee: string | null;
  submitted: boolean;
};

export function ChairReviews({ reviews }: { reviews: Named[] }) {
  return (
    <Card title="Reviews (chair's view)">
      {reviews.length === 0 ? (
        <p className="text-sm text-night-600">No reviewer assigned yet.</p>
      ) : (
        <ul className="grid gap-3 text-sm">
          {reviews.map((r) => (
            <li key={r.reviewer}>
              <p className="flex flex-wrap items-center gap-2 font-medium">
                {r.reviewer}
                {r.status === "declined" ? (
                  <Badge tone="danger">declined: {r.declineReason}</Badge>
                ) : (
                  <Badge tone={r.submitted ? "ok" : "caution"}>{r.submitted ? "submitted" : "not submitted"}</Badge>
                )}
                {r.submitted ? (
                  <span className="font-normal">
                    score {r.score ?? "—"}, confidence {r.confidence ?? "—"}
                  </span>
                ) : null}
              </p>
              {r.submitted ? (
                <>
                  <p className="whitespace-pre-wrap text-night-800">
                    <span className="font-medium">To the PI:</span> {r.commentToPi || "—"}
                  </p>
                  <p className="whitespace-pre-wrap text-night-800">
                    <span className="font-medium">To the committee:</span> {r.commentToCommittee || "—"}
                  </p>
                </>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

type Own = {
  score: number | null;
  confidence: string | null;
  commentToPi: string;
  commentToCommittee: string;
  submittedAt: string;
};

export function SubmittedReview({ review, scale }: { review: Own; scale: string }) {
  return (
    <Card title="Your review (submitted)">
      <dl className="grid gap-2 text-sm">
        <div>
          <dt className="text-night-600">Score ({scale})</dt>
          <dd className="font-medium">{review.score ?? "—"}</dd>
        </div>
        <div>
          <dt className="text-night-600">Confidence</dt>
          <dd className="font-medium">{review.confidence ?? "—"}</dd>
        </div>
        <div>
          <dt className="text-night-600">Comment to the PI</dt>
          <dd className="whitespace-pre-wrap">{review.commentToPi || "—"}</dd>
        </div>
        <div>
          <dt className="text-night-600">Comment to the committee</dt>
          <dd className="whitespace-pre-wrap">{review.commentToCommittee || "—"}</dd>
        </div>
        <div>
          <dt className="text-night-600">Submitted</dt>
          <dd className="num">{review.submittedAt}</dd>
        </div>
      </dl>
    </Card>
  );
}
