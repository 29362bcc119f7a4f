export function DemoTag({ show }: { show: boolean }) {
  return show ? (
    <span className="ml-1 rounded bg-caution-bg px-1.5 py-0.5 text-[10px] font-bold uppercase text-caution">
      demo values
    </span>
  ) : null;
}
