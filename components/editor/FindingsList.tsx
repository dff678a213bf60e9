/** The engine's findings that no claim mentions (see findings.ts), as a list beside the report. */
import type { GameSpec, State } from "@/lib/engine/types";
import type { Finding } from "./findings";

function stateText(state: State, game: GameSpec | undefined): string {
  const fmt = (x: number) => (Math.abs(x) < 5e-13 ? "0" : Number(x.toPrecision(4)).toString());
  if (game?.kind === "symmetric" && !Array.isArray(state[0])) {
    return (state as number[]).map((x, i) => `${game.strategies[i] ?? `s${i + 1}`} ${fmt(x)}`).join(", ");
  }
  if (game?.kind === "bimatrix" && Array.isArray(state[0])) {
    const [x, y] = state as [number[], number[]];
    const side = (v: number[], k: 0 | 1) => v.map((s, i) => `${game.populations[k].strategies[i] ?? `s${i + 1}`} ${fmt(s)}`).join(", ");
    return `${game.populations[0].name}: ${side(x, 0)}; ${game.populations[1].name}: ${side(y, 1)}`;
  }
  return JSON.stringify(state);
}

export function FindingsList({ findings, game }: { findings: readonly Finding[]; game?: GameSpec }) {
  if (findings.length === 0) {
    return <p className="text-sm text-ink-soft">Every rest point the engine found is covered by a claim, and every experiment is used.</p>;
  }
  return (
    <ul className="flex flex-col gap-2" data-testid="unclaimed-findings">
      {findings.map((f, i) => (
        <li key={`${f.kind}-${i}`} className="rounded-[var(--radius-control)] border-l-4 border-ochre bg-sunken/60 px-3 py-2 text-sm">
          <p>{f.text}</p>
          {f.restPoint === undefined ? null : <p className="mt-0.5 font-mono text-xs text-ink-soft">{stateText(f.restPoint.state, game)}</p>}
        </li>
      ))}
    </ul>
  );
}
