import Link from "next/link";
import { ArcwrightMark } from "@/components/arcwright-mark";
import { AccountMenu } from "@/components/account/account-menu";
import { AdminNavLink } from "@/components/admin/admin-nav-link";
import { primaryNavigation } from "@/components/navigation";

/** The frame around every page: product name, the areas of the product, and the page itself. */
export function AppShell({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-void-edge bg-void-raised print:hidden">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-8 gap-y-2 px-4 py-3">
          <Link href="/" className="flex items-center gap-2 text-lg font-semibold text-dusk no-underline">
            <ArcwrightMark className="h-7 w-7" />
            <span>Arcwright</span>
          </Link>
          <nav aria-label="Main" className="flex flex-wrap gap-x-5 gap-y-1 text-base">
            {primaryNavigation.map((item) => (
              <Link key={item.href} href={item.href} className="text-dusk-dim hover:text-dusk">
                {item.label}
              </Link>
            ))}
            <AdminNavLink className="text-dusk-dim hover:text-dusk" />
          </nav>
          <AccountMenu />
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">{children}</main>
      <footer className="border-t border-void-edge px-4 py-4 text-center text-sm text-dusk-dim print:hidden">
        Arcwright · exact light paths for lensing proposals
      </footer>
    </div>
  );
}
