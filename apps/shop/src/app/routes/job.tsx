import { useParams } from 'react-router-dom';
import { useMe } from '@benchwright/ui/auth';
import { RoleGate } from '../../components/layout';
import { JobAssignment } from '../../features/board/components/job-assignment';
import { TravellerPage } from '../../features/board/components/traveller';
import { useTeam } from '../../features/team/api/team';
import { ProjectUploads } from '../../features/uploads/components/project-uploads';
import { canAssignJobs, canRelayoutJobs, canSeeBoard } from '../../lib/policies';

export function JobRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  // the owner assigns the builder and the due date; builders read them
  const owner = canAssignJobs(me.data);
  const team = useTeam(owner);
  const staff = (team.data ?? []).filter((u) => u.role !== 'client');
  return (
    <RoleGate allow={canSeeBoard}>
      <TravellerPage
        id={id}
        canRelayout={canRelayoutJobs(me.data)}
        assignment={owner && team.data ? (job) => <JobAssignment key={job.id} job={job} staff={staff} /> : undefined}
        photos={(job, stageLabel) =>
          me.data ? (
            <ProjectUploads projectId={job.project.id} viewer={me.data} progress stageLabel={stageLabel} />
          ) : null
        }
      />
    </RoleGate>
  );
}
