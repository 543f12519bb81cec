package steelyard.bench;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeChoice;
import steelyard.lattice.LatticeSettings;
import steelyard.lattice.Lattices;
import steelyard.lm.BackoffModel;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Confusion-network build and LM-rescored search on synthetic 100-best lists (~15 tokens) with a word
 * 3-gram model counted from random Markov text. Targets (issue 4): build ≤ 0.5 ms per 100-best list,
 * search ≤ 2 ms per utterance at the default beam, search errors on ≤ 1 % of utterances. The search-error
 * rate (beam best scoring below the exact, unpruned best) is measured in setup and printed, with the
 * thread CPU time of build and search (JMH's figures are wall-clock and include time lost to other load).
 *
 * <p>Run: {@code java -cp ... org.openjdk.jmh.Main LatticeBenchmark -f 1 -wi 2 -i 3}
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 2, time = 1)
@Measurement(iterations = 3, time = 1)
@Fork(1)
public class LatticeBenchmark {
  private static final long SEED = 20261202L;
  private static final int VOCAB = 2000;
  private static final int UTTERANCES = 1000;
  private static final int HYPOTHESES = 100;

  /** λ′ of the search (arc posteriors and LM both natural log). */
  @Param({"1.0"})
  public double lmWeight;

  @Param({"" + LatticeSettings.DEFAULT_BEAM})
  public int beam;

  private BackoffModel lm;
  private final List<List<List<String>>> hyps = new ArrayList<>();
  private final List<double[]> posteriors = new ArrayList<>();
  private final List<ConfusionNetwork> networks = new ArrayList<>();
  private LatticeSettings settings;
  private int next;

  @Setup(Level.Trial)
  public void setUp() {
    SplittableRandom rnd = new SplittableRandom(SEED);
    int[][] successors = new int[VOCAB][];
    for (int w = 0; w < VOCAB; w++) {
      successors[w] = new int[8];
      for (int j = 0; j < 8; j++) successors[w][j] = rnd.nextInt(VOCAB);
    }
    lm = countedTrigramModel(rnd, successors, 300_000);
    for (int u = 0; u < UTTERANCES; u++) addUtterance(rnd, successors);
    settings = new LatticeSettings(lmWeight, 0, beam, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
    for (int u = 0; u < UTTERANCES; u++) networks.add(Lattices.network(hyps.get(u), posteriors.get(u), settings));
    reportSearchErrors();
  }

  /** Next utterance, round robin. */
  private int nextIndex() {
    int u = next;
    next = (next + 1) % UTTERANCES;
    return u;
  }

  @Benchmark
  public ConfusionNetwork buildNetwork() {
    int u = nextIndex();
    return Lattices.network(hyps.get(u), posteriors.get(u), settings);
  }

  @Benchmark
  public LatticeChoice searchBuiltNetwork() {
    int u = nextIndex();
    return Lattices.searchKBest(networks.get(u), hyps.get(u), posteriors.get(u), lm, settings, 1).get(0);
  }

  @Benchmark
  public LatticeChoice buildAndSearch() {
    int u = nextIndex();
    return Lattices.search(hyps.get(u), posteriors.get(u), lm, settings);
  }

  @Benchmark
  public LatticeChoice consensus() {
    int u = nextIndex();
    return Lattices.consensus(networks.get(u), hyps.get(u), posteriors.get(u));
  }

  /** Search errors of several beams against the exact search (unbounded beam), and the time each takes. */
  private void reportSearchErrors() {
    double[] exact = new double[UTTERANCES];
    java.lang.management.ThreadMXBean cpu = java.lang.management.ManagementFactory.getThreadMXBean();
    long t0 = cpu.getCurrentThreadCpuTime();
    LatticeSettings unbounded = new LatticeSettings(lmWeight, 0, Integer.MAX_VALUE, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
    long slots = 0;
    for (int u = 0; u < UTTERANCES; u++) {
      exact[u] = Lattices.searchKBest(networks.get(u), hyps.get(u), posteriors.get(u), lm, unbounded, 1).get(0).score();
      slots += networks.get(u).slotCount();
    }
    System.out.printf(Locale.ROOT, "%nlattice search, lm weight %.2f, %d utterances x %d hypotheses, %.1f slots per network%n",
        lmWeight, UTTERANCES, HYPOTHESES, (double) slots / UTTERANCES);
    System.out.printf(Locale.ROOT, "  exact: %.3f ms thread CPU per utterance (one pass, not JMH)%n", (cpu.getCurrentThreadCpuTime() - t0) / 1e6 / UTTERANCES);
    for (int pass = 0; pass < 3; pass++) {
      long t = cpu.getCurrentThreadCpuTime();
      for (int u = 0; u < UTTERANCES; u++) Lattices.network(hyps.get(u), posteriors.get(u), settings);
      if (pass == 2) System.out.printf(Locale.ROOT, "  build: %.3f ms thread CPU per %d-best list (third pass)%n",
          (cpu.getCurrentThreadCpuTime() - t) / 1e6 / UTTERANCES, HYPOTHESES);
    }
    for (int b : new int[] {2, 4, 8, 16, 32, 64, 128}) {
      LatticeSettings s = new LatticeSettings(lmWeight, 0, b, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
      int errors = 0;
      int fresh = 0;
      long t = cpu.getCurrentThreadCpuTime();
      for (int u = 0; u < UTTERANCES; u++) {
        LatticeChoice c = Lattices.searchKBest(networks.get(u), hyps.get(u), posteriors.get(u), lm, s, 1).get(0);
        if (c.score() < exact[u] - 1e-9) errors++;
        if (c.isNewTranscript()) fresh++;
      }
      System.out.printf(Locale.ROOT, "  beam %3d: search errors on %d of %d utterances (%.2f %%), %d new transcripts, %.3f ms thread CPU per utterance%n",
          b, errors, UTTERANCES, 100.0 * errors / UTTERANCES, fresh, (cpu.getCurrentThreadCpuTime() - t) / 1e6 / UTTERANCES);
    }
  }

  /** A reference of ~15 words from the chain and 100 noisy variants with softmax posteriors. */
  private void addUtterance(SplittableRandom rnd, int[][] successors) {
    List<String> ref = new ArrayList<>();
    int w = rnd.nextInt(VOCAB);
    int len = 10 + rnd.nextInt(11);
    for (int i = 0; i < len; i++) {
      ref.add("w" + w);
      w = successors[w][rnd.nextInt(8)];
    }
    List<List<String>> list = new ArrayList<>();
    double[] p = new double[HYPOTHESES];
    double sum = 0;
    for (int h = 0; h < HYPOTHESES; h++) {
      List<String> hyp = new ArrayList<>();
      for (String t : ref) {
        double x = rnd.nextDouble();
        if (x < 0.03) continue;
        hyp.add(x < 0.15 ? "w" + successors[rnd.nextInt(VOCAB)][0] : t);
        if (rnd.nextDouble() < 0.03) hyp.add("w" + rnd.nextInt(VOCAB));
      }
      list.add(hyp);
      sum += p[h] = Math.exp(-0.05 * h + rnd.nextDouble());
    }
    for (int h = 0; h < HYPOTHESES; h++) p[h] /= sum;
    hyps.add(list);
    posteriors.add(p);
  }

  /**
   * Counts 1–3-grams of random chain text and lists them with relative frequencies discounted by 0.8 and a
   * back-off weight of 0.2 (log10), not a normalised estimator: enough to give the search a real model shape.
   */
  static BackoffModel countedTrigramModel(SplittableRandom rnd, int[][] successors, int tokens) {
    BackoffModel.Builder b = new BackoffModel.Builder(3, Unit.WORD, NormalisationOptions.EXACT);
    int[] ids = new int[VOCAB];
    for (int w = 0; w < VOCAB; w++) ids[w] = b.tokenId("w" + w);
    int bos = b.tokenId("<s>");
    int eos = b.tokenId("</s>");
    List<Object2IntOpenHashMap<String>> counts = List.of(new Object2IntOpenHashMap<>(), new Object2IntOpenHashMap<>(), new Object2IntOpenHashMap<>());
    int[] sentence = new int[22];
    for (int done = 0; done < tokens; ) {
      int len = 5 + rnd.nextInt(16);
      int w = rnd.nextInt(VOCAB);
      sentence[0] = bos;
      for (int i = 1; i <= len; i++) {
        sentence[i] = ids[w];
        w = successors[w][rnd.nextInt(8)];
      }
      sentence[len + 1] = eos;
      for (int i = 0; i <= len + 1; i++) {
        for (int n = 1; n <= 3 && i - n + 1 >= 0; n++) counts.get(n - 1).addTo(key(sentence, i - n + 1, n), 1);
      }
      done += len;
    }
    double total = counts.get(0).values().intStream().sum();
    b.add(new int[] {b.tokenId("<unk>")}, -7, 0);
    for (int n = 1; n <= 3; n++) {
      for (var e : new java.util.TreeMap<>(counts.get(n - 1)).entrySet()) {
        int[] g = parse(e.getKey());
        double denom = n == 1 ? total : counts.get(n - 2).getInt(key(g, 0, n - 1));
        double log10 = g.length == 1 && g[0] == bos ? -99 : Math.log10(0.8 * e.getValue() / denom);
        b.add(g, log10, n < 3 ? Math.log10(0.2) : 0);
      }
    }
    return b.build();
  }

  private static String key(int[] s, int from, int n) {
    StringBuilder k = new StringBuilder();
    for (int i = 0; i < n; i++) k.append(i == 0 ? "" : " ").append(s[from + i]);
    return k.toString();
  }

  private static int[] parse(String key) {
    String[] parts = key.split(" ");
    int[] g = new int[parts.length];
    for (int i = 0; i < g.length; i++) g[i] = Integer.parseInt(parts[i]);
    return g;
  }
}
