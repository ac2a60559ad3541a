import { Text } from "@react-email/components";
import { EmailButton, EmailLayout, emailStyles } from "./EmailLayout";

export type RoleChangeEmailProps = {
  name: string;
  rolesGranted: string[];
  rolesRevoked: string[];
  /** Who made the change. */
  byName: string;
  /** The account page, when the message should link to it. */
  accountUrl?: string;
};

export const ROLE_CHANGE_SUBJECT = "Your roles in Fringe Docket have changed";

/** What each role lets a person do, in one phrase. */
const ROLE_WORDS: Record<string, { label: string; does: string }> = {
  proposer: { label: "Proposer", does: "write and submit proposals" },
  reviewer: { label: "Reviewer", does: "read and score the proposals assigned to you" },
  chair: { label: "Committee chair", does: "assign reviews, rank proposals and send the decisions" },
  scheduler: { label: "Scheduler", does: "build night plans and publish them" },
  admin: { label: "Administrator", does: "manage accounts, the array registry and the mailbox" },
};

function RoleList({ roles }: { roles: string[] }) {
  return (
    <ul style={emailStyles.list}>
      {roles.map((role) => {
        const words = ROLE_WORDS[role];
        return (
          <li key={role}>
            {words ? (
              <>
                <strong>{words.label}</strong> — {words.does}
              </>
            ) : (
              <strong>{role}</strong>
            )}
          </li>
        );
      })}
    </ul>
  );
}

/** Tells a person which roles were granted or taken away, and by whom. */
export function RoleChangeEmail({ name, rolesGranted, rolesRevoked, byName, accountUrl }: RoleChangeEmailProps) {
  const nothing = rolesGranted.length === 0 && rolesRevoked.length === 0;
  return (
    <EmailLayout preview={`${byName} changed your roles in Fringe Docket.`}>
      <Text style={emailStyles.heading}>Hello {name},</Text>
      <Text style={emailStyles.paragraph}>
        {nothing
          ? `${byName} reviewed your roles in Fringe Docket and left them as they were.`
          : `${byName} changed your roles in Fringe Docket.`}
      </Text>
      {rolesGranted.length > 0 ? (
        <>
          <Text style={{ ...emailStyles.paragraph, margin: "0 0 4px", fontWeight: 600 }}>
            From now on you can act as
          </Text>
          <RoleList roles={rolesGranted} />
        </>
      ) : null}
      {rolesRevoked.length > 0 ? (
        <>
          <Text style={{ ...emailStyles.paragraph, margin: "0 0 4px", fontWeight: 600 }}>You no longer act as</Text>
          <RoleList roles={rolesRevoked} />
        </>
      ) : null}
      <Text style={emailStyles.paragraph}>Your menus show the change the next time you open a page.</Text>
      {accountUrl ? (
        <EmailButton href={accountUrl} margin="4px 0 24px">
          Open your account
        </EmailButton>
      ) : null}
      <Text style={emailStyles.small}>If this looks wrong, please tell {byName} or the array's administrator.</Text>
    </EmailLayout>
  );
}
