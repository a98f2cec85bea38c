// Seeds the demo scenario once (idempotent), then prints how to sign in.
import { dbClient } from "@/db/client";
import { seedDemo } from "@/db/seed/demo";

const { db, sql } = dbClient();
try {
  const applied = await seedDemo(db);
  console.log(applied ? "[seed] demo scenario added" : "[seed] demo scenario already present; left as it is");
} finally {
  await sql.end();
}
