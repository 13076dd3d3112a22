/** /s/:publicId — the respondent app (no sign-in; personal links add ?inv=…, panels ?pid=…). */
import { useLocation, useParams } from 'react-router';
import { RespondentApp } from '@/features/respond/components/respondent-app';

export function Component() {
  const { publicId = '' } = useParams();
  const { search } = useLocation();
  return <RespondentApp key={publicId} publicId={publicId} search={search} />;
}
