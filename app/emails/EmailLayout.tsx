import { Body, Button, Container, Head, Hr, Html, Link, Preview, Section, Text } from "@react-email/components";
import type { CSSProperties, ReactNode } from "react";

/** The product's colours, as in app/app.css (night for the frame and text, ember for actions). */
export const emailColors = {
  night950: "#0d1220",
  night900: "#161c2d",
  night700: "#313a52",
  night600: "#414c66",
  night300: "#a5b0c8",
  night200: "#cdd4e3",
  night50: "#f4f6fa",
  ember700: "#a03611",
  white: "#ffffff",
} as const;

const fontFamily = '"IBM Plex Sans", Helvetica, Arial, sans-serif';

/** Shared inline styles for the templates (mail clients ignore most stylesheets). */
export const emailStyles = {
  heading: { margin: "0 0 16px", fontSize: "20px", lineHeight: "28px", fontWeight: 600, color: emailColors.night950 },
  paragraph: { margin: "0 0 16px", fontSize: "15px", lineHeight: "24px", color: emailColors.night700 },
  small: { margin: "0 0 12px", fontSize: "13px", lineHeight: "20px", color: emailColors.night600 },
  link: { color: emailColors.ember700, textDecoration: "underline", wordBreak: "break-all" },
  button: {
    display: "inline-block",
    backgroundColor: emailColors.ember700,
    color: emailColors.white,
    fontSize: "15px",
    fontWeight: 600,
    lineHeight: "20px",
    textDecoration: "none",
    borderRadius: "8px",
    padding: "12px 22px",
  },
  list: { margin: "0 0 16px", paddingLeft: "20px", fontSize: "15px", lineHeight: "24px", color: emailColors.night700 },
} satisfies Record<string, CSSProperties>;

const body: CSSProperties = { margin: 0, padding: "24px 0", backgroundColor: emailColors.night50, fontFamily };
const frame: CSSProperties = {
  maxWidth: "560px",
  margin: "0 auto",
  backgroundColor: emailColors.white,
  border: `1px solid ${emailColors.night200}`,
  borderRadius: "12px",
  overflow: "hidden",
};
const header: CSSProperties = { backgroundColor: emailColors.night900, padding: "18px 28px" };
const brand: CSSProperties = {
  margin: 0,
  fontSize: "18px",
  lineHeight: "24px",
  fontWeight: 600,
  color: emailColors.white,
  letterSpacing: "0.01em",
};
const tagline: CSSProperties = { margin: "2px 0 0", fontSize: "12px", lineHeight: "16px", color: emailColors.night300 };
const content: CSSProperties = { padding: "28px 28px 8px" };
const rule: CSSProperties = { borderColor: emailColors.night200, margin: "0 28px" };
const footer: CSSProperties = { padding: "14px 28px 22px" };
const footerText: CSSProperties = { margin: 0, fontSize: "12px", lineHeight: "18px", color: emailColors.night600 };

/**
 * The frame every Fringe Docket e-mail shares: the night-blue band with the product name, the
 * message, and a footer line saying why the message came.
 */
export function EmailLayout({ preview, children }: { preview: string; children: ReactNode }) {
  return (
    <Html lang="en">
      <Head>
        <meta name="color-scheme" content="light" />
      </Head>
      <Preview>{preview}</Preview>
      <Body style={body}>
        <Container style={frame}>
          <Section style={header}>
            <Text style={brand}>Fringe Docket</Text>
            <Text style={tagline}>The observing cycle of the array</Text>
          </Section>
          <Section style={content}>{children}</Section>
          <Hr style={rule} />
          <Section style={footer}>
            <Text style={footerText}>
              Fringe Docket wrote this message because of a change to your account or your programmes. It was sent
              automatically; replies are not read.
            </Text>
          </Section>
        </Container>
      </Body>
    </Html>
  );
}

/** "Hello Name," or, for an address without an account, "Hello,". */
export function EmailGreeting({ name }: { name: string | null }) {
  return <Text style={emailStyles.heading}>{name ? `Hello ${name},` : "Hello,"}</Text>;
}

/** The message's call to action: a button-styled link in a block of its own. */
export function EmailButton({
  href,
  margin = "8px 0 24px",
  children,
}: {
  href: string;
  margin?: string;
  children: ReactNode;
}) {
  return (
    <Section style={{ margin }}>
      <Button href={href} style={emailStyles.button}>
        {children}
      </Button>
    </Section>
  );
}

/** The button's address spelled out, for mail clients where the button does nothing. */
export function EmailLinkFallback({ url }: { url: string }) {
  return (
    <>
      <Text style={emailStyles.small}>If the button does nothing, copy this address into your browser:</Text>
      <Text style={emailStyles.small}>
        <Link href={url} style={emailStyles.link}>
          {url}
        </Link>
      </Text>
    </>
  );
}
