// Splits a plain-text e-mail into lines and marks the web links in them, so the Outbox can show the
// text as it was sent with its links usable. Only http(s) links are made live.
export type MailPart = { kind: 'text'; text: string } | { kind: 'link'; url: string };

export interface MailLine {
  parts: MailPart[];
  hasLink: boolean;
}

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
// A sentence's closing punctuation is not part of the link.
const TRAILING = /[.,;:!?)\]]+$/;

export function splitMailText(text: string): MailLine[] {
  return text.split(/\r?\n/).map((line) => {
    const parts: MailPart[] = [];
    let last = 0;
    for (const match of line.matchAll(URL_PATTERN)) {
      const raw = match[0];
      const url = raw.replace(TRAILING, '');
      const start = match.index ?? 0;
      if (start > last) parts.push({ kind: 'text', text: line.slice(last, start) });
      parts.push({ kind: 'link', url });
      last = start + url.length;
    }
    if (last < line.length) parts.push({ kind: 'text', text: line.slice(last) });
    return { parts, hasLink: parts.some((p) => p.kind === 'link') };
  });
}
