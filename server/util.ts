/** Unix ms → ISO string for the API. */
export const iso = (ms: number) => new Date(ms).toISOString();
export const isoOrNull = (ms: number | null) => (ms === null ? null : iso(ms));
