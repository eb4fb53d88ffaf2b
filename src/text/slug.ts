/** The path segment a page gets from an id: lower case letters and digits joined by hyphens. */
export const slugOf = (id: string) =>
  id
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '') || 'item';
