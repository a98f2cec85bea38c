// Seeds the demo scenario once (idempotent), then prints how to sign in.
import { dbClient } from "@/db/client";
import { seedDemo } from "@/db/seed/demo";
import { demoAccounts } from "@/db/seed/demo-scenario";
import { roleLabels } from "@/lib/workspace/roles";

const { db, sql } = dbClient();
try {
  const applied = await seedDemo(db);
  console.log(applied ? "[seed] demo scenario added" : "[seed] demo scenario already present; left as it is");
  console.log("[seed] demo accounts (sign in at /sign-in):");
  for (const account of demoAccounts) {
    const role = account.key === "admin" ? "site admin" : `${roleLabels[account.key]} of the demo proposal`;
    console.log(`[seed]   ${role.padEnd(28)} ${account.email.padEnd(38)} password: ${account.password}`);
  }
} finally {
  await sql.end();
}
