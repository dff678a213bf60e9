import { LogoMark } from "@/components/brand/LogoMark";
import { VERDICT_STYLES, VERDICT_VALUES, VerdictTag } from "@/components/status/VerdictTag";
import { ButtonLink } from "@/components/ui/Button";
import { getActor } from "@/lib/authz";

const CHECKS: { title: string; body: string }[] = [
  { title: "Rest points and their stability", body: "Is there a rest point where the paper says, and is it asymptotically stable, unstable or non-hyperbolic?" },
  { title: "Nash equilibria and ESS", body: "Is the state a symmetric Nash equilibrium, and is it evolutionarily stable, decided exactly, including the non-regular cases?" },
  { title: "How many rest points", body: "Does the replicator dynamics have exactly the stated number of isolated rest points, in the interior or anywhere?" },
  { title: "Where runs end up", body: "From a given start, does the solution reach the stated final state, and pass through the stated points on the way?" },
  { title: "Fixation probabilities", body: "Does a single mutant fix with the stated probability under the frequency-dependent Moran process?" },
];

const STEPS: { title: string; body: string }[] = [
  { title: "Deposit", body: "An author uploads a model specification: strategies, payoffs, parameters, dynamics and the claims the paper makes." },
  { title: "Re-run", body: "The server runs every uploaded version itself. Versions are immutable; a change is a new version." },
  { title: "Report", body: "Claim by claim: what was confirmed, contradicted or could not be decided, with the numeric deviation." },
  { title: "Decide", body: "Editors of a journal or collection work through their queue and record a decision on each submitted version." },
];

export default async function HomePage() {
  const actor = await getActor();
  return (
    <div className="flex flex-col gap-16">
      <section className="grid items-center gap-10 md:grid-cols-[1.4fr_1fr]">
        <div className="flex flex-col gap-5">
          <p className="text-xs font-semibold uppercase tracking-[0.14em] text-ochre">A registry of re-run models</p>
          <h1 className="text-4xl font-bold tracking-tight text-ink">Evolutionary game models, re-run and checked claim by claim.</h1>
          <p className="max-w-xl text-lg text-ink-soft">
            Authors deposit the model behind a paper. Restpoint computes its rest points, equilibria and trajectories again and tells everyone which of the paper&apos;s numerical claims it could reproduce.
          </p>
          <div className="flex flex-wrap gap-3">
            {actor === null ? (
              <>
                <ButtonLink href="/sign-up">Create an account</ButtonLink>
                <ButtonLink href="/sign-in" kind="secondary">
                  Sign in
                </ButtonLink>
              </>
            ) : (
              <ButtonLink href="/workspace">Go to your workspace</ButtonLink>
            )}
          </div>
          <p className="text-xs text-ink-faint">Readers need no account. A confirmed claim means the numbers were reproduced, not that the model was peer reviewed.</p>
        </div>
        <div className="rp-card flex flex-col gap-4 p-6">
          <div className="flex items-center gap-3">
            <LogoMark size={40} />
            <div>
              <p className="font-semibold">What a report says</p>
              <p className="text-xs text-ink-faint">Every status comes with its word and its sign.</p>
            </div>
          </div>
          <ul className="flex flex-col gap-3">
            {VERDICT_VALUES.map((v) => (
              <li key={v} className="flex flex-col items-start gap-1">
                <VerdictTag verdict={v} />
                <span className="text-sm text-ink-soft">{VERDICT_STYLES[v].meaning}</span>
              </li>
            ))}
          </ul>
        </div>
      </section>

      <section className="flex flex-col gap-6" aria-labelledby="checks">
        <h2 id="checks" className="text-2xl font-semibold">
          What Restpoint checks
        </h2>
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {CHECKS.map((c) => (
            <li key={c.title} className="rp-card flex flex-col gap-2 p-5">
              <h3 className="font-semibold">{c.title}</h3>
              <p className="text-sm text-ink-soft">{c.body}</p>
            </li>
          ))}
        </ul>
      </section>

      <section className="flex flex-col gap-6" aria-labelledby="steps">
        <h2 id="steps" className="text-2xl font-semibold">
          From deposit to decision
        </h2>
        <ol className="grid gap-4 md:grid-cols-4">
          {STEPS.map((s, i) => (
            <li key={s.title} className="flex flex-col gap-2 border-t-2 border-tide pt-4">
              <span className="font-mono text-sm text-ochre">{String(i + 1).padStart(2, "0")}</span>
              <h3 className="font-semibold">{s.title}</h3>
              <p className="text-sm text-ink-soft">{s.body}</p>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
