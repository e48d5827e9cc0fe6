import { pathTo } from '../../../shared/api/paths';

/** The two routes a flight sync uses: summary first, raw log second. */
export const flightPath = (id: string) => pathTo('flight', { id });
export const flightRawPath = (id: string) => pathTo('flightRaw', { id });
