package steelyard.bench;

import java.util.Locale;
import java.util.Set;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.MethodFigures;
import steelyard.tune.Sweep;
import steelyard.tune.TuneInput;
import steelyard.tune.TuneProgress;
import steelyard.tune.TuneResult;
import steelyard.tune.TuneSettings;
import steelyard.tune.Tuner;
import steelyard.tune.WeightNames;
import steelyard.tune.WeightSweep;

/**
 * Tuning figures on a generated dev set ({@link TuneBenchData}; default 10 000 utterances × 100 hypotheses = 1 M):
 * one exact line search along λ (features already computed; the sweep also counts helped/hurt/changed), a full
 * N-best tune of three weights (lm feature, λ, μ) with 5 restarts, with and without 5-fold cross-validation, and
 * a lattice-method tune. Targets (issue 8): ≤ 0.3 s, ≤ 10 s, ≤ 60 s on 2 cores. Wall-clock times.
 *
 * <pre>
 * mvn -o -q -B test-compile
 * java -Xmx8g -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.TuneBench [UTTS] [HYPS] [THREADS] [line,nbest,lattice]
 * </pre>
 */
public final class TuneBench {
  private TuneBench() {}

  public static void main(String[] args) {
    int utts = args.length > 0 ? Integer.parseInt(args[0]) : 10_000;
    int hyps = args.length > 1 ? Integer.parseInt(args[1]) : 100;
    int threads = args.length > 2 ? Integer.parseInt(args[2]) : 2;
    String parts = args.length > 3 ? args[3] : "line,nbest,lattice";
    long t = System.nanoTime();
    TuneInput in = TuneBenchData.make(utts, hyps, 20261202L);
    System.out.printf(Locale.ROOT, "data: %d utterances x %d hypotheses, scored in %.1f s; %d threads%n", utts, hyps, secs(t), threads);
    if (parts.contains("line")) lineSearch(in, threads);
    if (parts.contains("nbest")) {
      TuneSettings s = TuneSettings.builder().methods(Set.of(RescoreMethod.NBEST)).threads(threads)
          .tune(Set.of("lm", WeightNames.LM, WeightNames.LENGTH)).surface(false).build();
      tune("N-best, 3 weights, 5 restarts, no folds", in, s.toBuilder().folds(0).build());
      tune("N-best, 3 weights, 5 restarts, 5 folds", in, s);
    }
    if (parts.contains("lattice")) {
      TuneSettings s = TuneSettings.builder().methods(Set.of(RescoreMethod.LATTICE)).threads(threads).surface(false).build();
      tune("lattice, no folds", in, s.toBuilder().folds(0).build());
      tune("lattice, 5 folds", in, s);
    }
  }

  private static void lineSearch(TuneInput in, int threads) {
    long t = System.nanoTime();
    WeightSweep sweeps = WeightSweep.of(in, threads);
    System.out.printf(Locale.ROOT, "errors of every hypothesis against its reference: %.2f s (once)%n", secs(t));
    RescoreWeights at = in.start();
    for (int i = 0; i < 7; i++) {
      t = System.nanoTime();
      long c = cpu();
      Sweep s = sweeps.nbest(at, WeightNames.LM, 0, 50);
      double lm = secs(t);
      double lmCpu = (cpu() - c) / 1e9;
      t = System.nanoTime();
      c = cpu();
      Sweep l = sweeps.nbest(at, WeightNames.LENGTH, -50, 50);
      System.out.printf(Locale.ROOT,
          "exact line search %d: along lm_weight %.3f s wall %.3f s CPU (%d intervals), along length_weight %.3f s wall %.3f s CPU (%d)%n",
          i, lm, lmCpu, s.intervals(), secs(t), (cpu() - c) / 1e9, l.intervals());
    }
  }

  private static void tune(String what, TuneInput in, TuneSettings s) {
    long t = System.nanoTime();
    long c = cpu();
    TuneResult r = Tuner.tune(in, s, TuneProgress.NONE, () -> false);
    double took = secs(t);
    double cpu = (cpu() - c) / 1e9;
    MethodFigures f = r.figures(r.method());
    System.out.printf(Locale.ROOT,
        "%s: %.1f s wall, %.1f s process CPU; rank 1 %.2f %%, tuned %.2f %%, CV %.2f %%, %d iterations; weights %s%n", what, took, cpu,
        100 * r.devFirstErrorRate(), 100 * f.devErrorRate(), 100 * f.cvErrorRate(), f.iterations(), f.weights());
  }

  /** CPU time of the whole process (all threads), in ns: what a quiet machine would spread over its cores. */
  private static long cpu() {
    return ((com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean())
        .getProcessCpuTime();
  }

  private static double secs(long from) {
    return (System.nanoTime() - from) / 1e9;
  }
}
