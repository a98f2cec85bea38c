// Characters XML 1.0 does not allow (§2.2): C0 controls other than tab, LF and CR, and U+FFFE/U+FFFF.
const NOT_XML = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;

/** Text with the characters XML 1.0 does not allow dropped; an XML builder escapes the rest. */
export function xmlCharacters(text: string): string {
  return text.replace(NOT_XML, "");
}

/** Text or attribute value safe in XML 1.0: markup characters escaped, disallowed control characters dropped. */
export function escapeXml(text: string): string {
  return xmlCharacters(text).replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&apos;" })[c]!);
}
