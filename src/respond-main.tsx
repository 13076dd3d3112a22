/**
 * The respondent app's own entry (respond.html, served for /s/:publicId in production): only
 * React and the respondent screens, without the router, query cache, schemas or researcher
 * screens, so the first screen arrives quickly on a slow phone connection. In development the
 * main app's /s/:publicId route renders the same component. The session request has usually
 * left already (src/respond-boot.ts).
 */
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import './styles/index.css';
import { RespondentApp } from './features/respond/components/respondent-app';
import { publicIdFromPath } from './features/respond/utils/public-id';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <RespondentApp
      publicId={publicIdFromPath(window.location.pathname)}
      search={window.location.search}
    />
  </StrictMode>,
);
