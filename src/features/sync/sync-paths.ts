/** The two routes a flight sync uses (issue 6): summary first, raw log second. */
export const flightPath = (id: string) => `/api/flights/${encodeURIComponent(id)}`;
export const flightRawPath = (id: string) => `/api/flights/${encodeURIComponent(id)}/raw`;
