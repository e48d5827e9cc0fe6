/** API paths shared by the client and the server so neither spells them alone. */
export const paths = {
  health: '/api/health',
} as const;
