import { request as playwrightRequest } from '@playwright/test';
import { e2eBaseUrl } from '../../playwright.config';

/**
 * A request context for the API, sending the Origin the app's own pages send: the server
 * refuses writes with a session but without an Origin.
 */
export function newApiContext() {
  return playwrightRequest.newContext({
    baseURL: e2eBaseUrl,
    extraHTTPHeaders: { Origin: e2eBaseUrl },
  });
}
