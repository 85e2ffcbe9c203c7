/** The citation line of a saved comparison: title, author, date, link and data hash. Pure. */
export function citationLine(c: { title: string; author: string; createdAt: string; link: string; dataSha256: string }): string {
  return `${c.author} (${c.createdAt.slice(0, 10)}). ${c.title}. Evenload saved comparison. ${c.link} (data sha256 ${c.dataSha256}).`;
}
