/**
 * What the API asks of the identity provider besides sign-in: a single-use, expiring link
 * at which an invited person sets their password. Production identity providers offer the
 * same through their management APIs; the local fake implements this small protocol.
 */
export interface IdentityProviderAdmin {
  createPasswordTicket(input: {
    email: string;
    name: string;
    /** Where the provider sends the person once the password is set (our sign-in). */
    returnTo: string;
    expiresInSeconds: number;
  }): Promise<{ url: string; expiresAt: string; accountExists: boolean }>;
}

export function httpIdentityProviderAdmin(
  issuer: string,
  adminToken: string,
): IdentityProviderAdmin {
  return {
    async createPasswordTicket(input) {
      const res = await fetch(`${issuer}/admin/password-tickets`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${adminToken}` },
        body: JSON.stringify(input),
      });
      if (!res.ok) throw new Error(`identity provider refused the password link (${res.status})`);
      return (await res.json()) as { url: string; expiresAt: string; accountExists: boolean };
    },
  };
}
