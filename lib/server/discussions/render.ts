/**
 * Comment bodies are plain text with a small markdown subset. They are rendered once, on the
 * server, when saved: markdown → HTML with `marked`, then an allow-list pass with `sanitize-html`,
 * so no script, event handler, style or `javascript:` URL reaches a browser, whatever was typed.
 */
import "server-only";
import { Marked } from "marked";
import sanitizeHtml from "sanitize-html";

const markdown = new Marked({ gfm: true, breaks: true });

const ALLOWED: sanitizeHtml.IOptions = {
  // No images (tracking pixels), no headings (a comment is not a page), no tables, no raw HTML
  // beyond these tags.
  allowedTags: ["p", "br", "strong", "em", "del", "code", "pre", "blockquote", "ul", "ol", "li", "a", "hr"],
  allowedAttributes: { a: ["href", "title", "rel"] },
  allowedSchemes: ["http", "https", "mailto"],
  allowedSchemesAppliedToAttributes: ["href"],
  allowProtocolRelative: false,
  // Text of removed elements (e.g. <b onclick>) stays; script/style contents go entirely.
  disallowedTagsMode: "discard",
  transformTags: { a: sanitizeHtml.simpleTransform("a", { rel: "nofollow noopener noreferrer" }) },
};

/** Safe HTML for a comment body (trimmed, at most a few kB: the schema limits its length). */
export function renderCommentHtml(body: string): string {
  const html = markdown.parse(body, { async: false });
  return sanitizeHtml(html, ALLOWED).trim();
}
