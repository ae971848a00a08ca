import { CalcTabs } from "@/components/calc/calc-tabs";

// Every calculator shares the tab row; each page checks "calc:use" itself and reads the person's units.
export default function CalcLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="mx-auto max-w-[90rem]">
      <CalcTabs />
      {children}
    </div>
  );
}
