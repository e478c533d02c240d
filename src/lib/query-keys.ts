// Query keys that more than one feature must agree on. Feature-private keys
// live beside their query options instead.

/** The signed-in person (GET /api/me): roles and flags change when memberships do. */
export const meQueryKey = ['me'] as const;
