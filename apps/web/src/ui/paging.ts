/** "21–40 of 57" for a page of a list; "0 of 0" when empty. */
export function pageRange(
  page: number,
  pageSize: number,
  total: number,
): { first: number; last: number; pages: number } {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (total === 0) return { first: 0, last: 0, pages };
  const first = Math.min((page - 1) * pageSize + 1, total);
  const last = Math.min(page * pageSize, total);
  return { first, last, pages };
}
