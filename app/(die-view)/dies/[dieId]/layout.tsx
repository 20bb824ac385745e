import { DieHeader } from "@/components/die-view/die-header";
import { loadDie } from "./load-die";

/** The die's top bar above whatever the die route shows (the workspace, or its loading and error states). */
export default async function DieLayout({ params, children }: { params: Promise<{ dieId: string }>; children: React.ReactNode }) {
  const { dieId } = await params;
  const { die } = await loadDie(dieId);
  return (
    <>
      <DieHeader initial={die} />
      {children}
    </>
  );
}
