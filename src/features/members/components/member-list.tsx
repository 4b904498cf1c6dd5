import { roleLabels } from "../../../../shared/permissions";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useMembers } from "../api/get-members";

export function MemberList({ campaignId }: { campaignId: string }) {
  const members = useMembers(campaignId);

  if (members.data === undefined) {
    if (members.isError) {
      return (
        <Notice tone="danger" title="Members not loaded" live>
          {messageOf(members.error)}
        </Notice>
      );
    }
    if (members.fetchStatus === "paused") {
      return (
        <Notice tone="attention" title="Offline">
          The member list appears once you are online.
        </Notice>
      );
    }
    return <Loading label="Loading members…" />;
  }
  return (
    <div className="relative overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse">
        <caption className="sr-only">Members of this campaign</caption>
        <thead className="bg-sunken text-left text-sm">
          <tr>
            <th scope="col" className="px-4 py-2">
              Name
            </th>
            <th scope="col" className="px-4 py-2">
              E-mail
            </th>
            <th scope="col" className="px-4 py-2">
              Role
            </th>
          </tr>
        </thead>
        <tbody>
          {members.data.map((member) => (
            <tr key={member.userId} className="border-t border-line">
              <th scope="row" className="px-4 py-3 text-left font-semibold">
                {member.name}
              </th>
              <td className="px-4 py-3 break-all">{member.email}</td>
              <td className="px-4 py-3">{roleLabels[member.role]}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
