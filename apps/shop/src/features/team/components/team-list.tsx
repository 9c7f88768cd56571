import { Notice } from '@benchwright/ui';
import { useTeam } from '../api/team';

export function TeamList() {
  const q = useTeam();
  if (q.isPending) return <p>Loading…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  return (
    <table className="w-full border-collapse text-left">
      <thead>
        <tr className="border-b-2 border-rule">
          <th className="py-2">Name</th>
          <th className="py-2">E-mail</th>
          <th className="py-2">Role</th>
        </tr>
      </thead>
      <tbody>
        {q.data.map((u) => (
          <tr key={u.id} className="border-b border-rule">
            <td className="py-2">{u.name}</td>
            <td className="py-2">{u.email}</td>
            <td className="py-2">{u.role === 'owner' ? 'Owner' : u.emailVerified ? 'Builder' : 'Builder (invited)'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
