import { Button, Section } from "@react-email/components";
import { emailStyles } from "./EmailLayout";

/** The button of a proposal's notices that opens the proposal's page. */
export function ProposalButton({ url, label = "See the proposal" }: { url: string; label?: string }) {
  return (
    <Section style={{ margin: "8px 0 24px" }}>
      <Button href={url} style={emailStyles.button}>
        {label}
      </Button>
    </Section>
  );
}
