/**
 * Downloads are plain links: the browser streams the file to disk (a fetch would hold it in memory), and the
 * session cookie authorises them. GET needs no CSRF token.
 */
export const exportCsvUrl = (id: number) => `/api/data-requests/${id}/export.csv`;
export const dictionaryUrl = (id: number, format: 'csv' | 'md') =>
  `/api/data-requests/${id}/dictionary?format=${format}`;
