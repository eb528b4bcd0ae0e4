/** @jsxRuntime automatic @jsxImportSource react */
import { Body, Button, Container, Head, Hr, Html, Link, Preview, Section, Text } from "@react-email/components";
import type { ReactNode } from "react";

/** Every template gets the app's public address so each link it prints is absolute, and the school's name (SCHOOL_NAME). */
export interface MailFrame {
  appUrl: string;
  schoolName: string;
}

/** Mail readers open links outside the app, so a relative link would lead nowhere. */
export function absoluteUrl(url: string, appUrl: string): string {
  return new URL(url, appUrl).toString();
}

// Inline styles only: many mail readers drop <style> blocks (common practice). Colours follow the site's palette.
const page = {
  backgroundColor: "#F3EADB",
  fontFamily: "Georgia, Cambria, 'Times New Roman', serif",
  margin: 0,
  padding: "24px 0",
};
const card = {
  backgroundColor: "#FBF7F0",
  border: "1px solid #D9C8B0",
  borderRadius: "10px",
  maxWidth: "560px",
  padding: "32px",
};
const brand = { color: "#8A3B12", fontSize: "20px", fontWeight: 700, margin: "0 0 16px" };
const footer = { color: "#5E4B3C", fontSize: "13px", lineHeight: "20px", margin: 0 };
const button = {
  backgroundColor: "#8A3B12",
  borderRadius: "6px",
  color: "#FBF7F0",
  display: "inline-block",
  fontSize: "16px",
  padding: "12px 20px",
  textDecoration: "none",
};

export const paragraph = { color: "#24190F", fontSize: "16px", lineHeight: "26px", margin: "0 0 16px" };

export function MailLayout({
  preview,
  appUrl,
  schoolName,
  children,
}: MailFrame & { preview: string; children: ReactNode }) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body style={page}>
        <Container style={card}>
          <Text style={brand}>{schoolName}</Text>
          {children}
          <Hr style={{ borderColor: "#D9C8B0", margin: "24px 0 16px" }} />
          <Text style={footer}>
            {schoolName}, an online fiddle school on Rosinwood ·{" "}
            <Link href={absoluteUrl("/", appUrl)} style={{ color: "#8A3B12" }}>
              {new URL(appUrl).host}
            </Link>
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

/** The one thing the reader should do, as a button, with the address written out for readers that hide buttons. */
export function MailAction({ href, label }: { href: string; label: string }) {
  return (
    <Section style={{ margin: "8px 0 24px" }}>
      <Button href={href} style={button}>
        {label}
      </Button>
      <Text style={{ ...paragraph, fontSize: "13px", color: "#5E4B3C", margin: "16px 0 0" }}>
        If the button does not work, copy this address into your browser:{" "}
        <Link href={href} style={{ color: "#8A3B12", wordBreak: "break-all" }}>
          {href}
        </Link>
      </Text>
    </Section>
  );
}
