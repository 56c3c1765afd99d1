import Link from "next/link";
import { ResearchCaution } from "@/components/layout/footer";
import { Logo } from "@/components/layout/logo";

export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="mx-auto flex w-full max-w-6xl items-center justify-between px-6 py-5">
        <Link href="/" className="flex items-center gap-2 text-lg font-semibold">
          <Logo className="h-7 w-7" />
          Morphokin
        </Link>
        <nav className="flex items-center gap-4 text-sm">
          <Link href="/login" className="text-ink-soft hover:text-ink">
            Sign in
          </Link>
          <Link href="/signup" className="rounded-md bg-moss px-3 py-1.5 font-medium text-white hover:bg-moss-dark">
            Create an account
          </Link>
        </nav>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-6 py-6">{children}</main>
      <ResearchCaution />
    </div>
  );
}
