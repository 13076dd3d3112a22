/**
 * The respondent page's first script (added to respond.html by the build, with `async`): it
 * sends the session request as soon as it arrives, while React is still on its way, so on a
 * slow phone the network and the download overlap. The app picks up the same request.
 */
import { prefetchSession } from './features/respond/api/start-session';
import { publicIdFromPath } from './features/respond/utils/public-id';

const publicId = publicIdFromPath(window.location.pathname);
// Failures are handled where the app awaits the same request.
if (publicId) prefetchSession(publicId, window.location.search).catch(() => {});
