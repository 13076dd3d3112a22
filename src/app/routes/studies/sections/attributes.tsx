import { useParams } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { Spinner } from '@/components/ui/feedback';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useStudy } from '@/features/studies/api/get-study';
import { useSaveDefinition } from '@/features/studies/api/save-definition';
import { useUploadLevelImage } from '@/features/attributes/api/upload-level-image';
import { AttributesEditor } from '@/features/attributes/components/attributes-editor';
import { designKeys } from '@/features/design/api/design-keys';

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const qc = useQueryClient();
  const { data: study } = useStudy(teamId, studyId);
  const save = useSaveDefinition(teamId, studyId, () =>
    qc.invalidateQueries({ queryKey: designKeys.state(teamId, studyId) }),
  );
  const upload = useUploadLevelImage(teamId, studyId);
  if (!study) return <Spinner />;
  const canWrite = can('study:write');
  const frozen = study.status !== 'draft';
  return (
    <AttributesEditor
      definition={study.definition}
      readOnly={!canWrite || frozen}
      readOnlyReason={
        frozen
          ? `This study is ${study.status}: its attributes are frozen. Reopen it as a draft to change them.`
          : !canWrite
            ? 'Your role can read the attributes but not change them.'
            : undefined
      }
      save={(d) => save.mutateAsync(d)}
      uploadImage={(f) => upload.mutateAsync(f)}
    />
  );
}
