/** Which requests the access, rate and load rules apply to: the /v1 API, not health, metrics, OpenAPI or the page. */
export function isApiPath(url: string): boolean {
  const path = url.split('?')[0];
  return path === '/v1' || path.startsWith('/v1/');
}
