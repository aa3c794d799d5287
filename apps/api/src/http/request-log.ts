/**
 * What the request log may keep of a URL: the path and the query's names, with the values
 * of secrets blanked. Invitation and reset links carry their one-time token in the query
 * (`/accept-invite?token=…`), and a log is read by more people than the token is meant for.
 */
const SECRET_PARAM = /token|password|secret|key|code|sig/i;

export function loggableUrl(url: string): string {
  const q = url.indexOf('?');
  if (q < 0) return url;
  const params = new URLSearchParams(url.slice(q + 1));
  const kept: string[] = [];
  for (const [name, value] of params) {
    kept.push(`${encodeURIComponent(name)}=${SECRET_PARAM.test(name) ? '[redacted]' : encodeURIComponent(value)}`);
  }
  return kept.length ? `${url.slice(0, q)}?${kept.join('&')}` : url.slice(0, q);
}
