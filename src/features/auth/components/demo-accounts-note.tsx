import { roleLabels, type Role } from "../../../../shared/permissions";

const demoAccounts: readonly { email: string; role: Role }[] = [
  { email: "field@demo.equipot.test", role: "field" },
  { email: "logistics@demo.equipot.test", role: "logistics" },
  { email: "geodesist@demo.equipot.test", role: "geodesist" },
  { email: "reviewer@demo.equipot.test", role: "reviewer" },
  { email: "admin@demo.equipot.test", role: "admin" },
];

/** Shown only when the server says it runs the demo (GET /api/health → demo: true). */
export function DemoAccountsNote() {
  return (
    <section
      aria-labelledby="demo-accounts"
      className="rounded-lg border border-dashed border-line bg-sunken p-4"
    >
      <h2 id="demo-accounts" className="font-semibold">
        Demo accounts
      </h2>
      <p className="mt-1 text-sm text-muted">
        This server runs the demo campaign. Every account uses the password{" "}
        <code className="font-semibold whitespace-nowrap text-ink">equipot-demo</code>.
      </p>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        {demoAccounts.map((account) => (
          <div key={account.email} className="contents">
            <dt className="font-semibold">{roleLabels[account.role]}</dt>
            <dd className="break-words">{account.email}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
