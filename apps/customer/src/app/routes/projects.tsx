import { Navigate, useSearchParams } from 'react-router-dom';
import { Notice, Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { useMe } from '@benchwright/ui/auth';
import { ProjectList } from '../../features/projects/components/project-list';

export function ProjectsRoute() {
  const me = useMe();
  const [params] = useSearchParams();
  if (me.isPending) return <p>Loading…</p>;
  if (!me.data) return <Navigate to={paths.signIn.getHref(paths.projects.getHref())} replace />;
  return (
    <>
      {params.get('welcome') ? (
        <Notice tone="ok">
          Welcome, {me.data.name}. We have sent a link to {me.data.email}: open it to confirm your e-mail.
        </Notice>
      ) : null}
      {!me.data.emailVerified && !params.get('welcome') ? (
        <Notice>Your e-mail is not confirmed yet: look for our message at {me.data.email}.</Notice>
      ) : null}
      <Panel level={1} title="My projects">
        <ProjectList />
      </Panel>
    </>
  );
}
