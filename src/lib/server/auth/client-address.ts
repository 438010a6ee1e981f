/**
 * The address a request came from, for throttling. Behind a proxy this is the proxy's address
 * unless the adapter is told to trust forwarding headers; see DEVELOPERS.md.
 */
export function clientAddressOf(context: { clientAddress: string }): string {
  try {
    return context.clientAddress || 'unknown';
  } catch {
    return 'unknown';
  }
}
