package steelyard.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import steelyard.audit.AuditInput;
import steelyard.audit.AuditReport;
import steelyard.audit.AuditSettings;
import steelyard.audit.OverruleAuditor;
import steelyard.eval.Aligner;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.SyntheticHypotheses;
import steelyard.io.UtteranceHypotheses;
import steelyard.lattice.LatticeSettings;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.Tokenizer;
import steelyard.rescore.UtteranceResult;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * Audit of every overrule of a rescored 1 M-hypothesis set (10 000 utterances × 100, from
 * {@link SyntheticHypotheses}, as {@code RescoreBenchmark}): a word 3-gram trained on 50 000 sentences of the same
 * grammar, N-best at λ = 0.05, μ = 0 (features {@code acoustic,lm} at weight 1: the noisy score columns overrule rank 1 in
 * about a third of the utterances), every utterance with a reference (its rank-1
 * text with the first word dropped, so verdicts vary). Setup (generate, train, score, choose) is not timed; each
 * round times {@link OverruleAuditor#auditAll} over the kept results on one thread. (The network methods are not
 * measured here: on this generator every lower rank alters a few words of rank 1 at random places, so the
 * network's majority is rank 1 and they make next to no overrules.)
 *
 * <pre>
 * mvn -o -q -B test-compile
 * java -Xmx8g -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.AuditBenchmark [utterances] [per] [rounds]
 * </pre>
 */
public final class AuditBenchmark {
  private static final java.lang.management.ThreadMXBean THREADS = java.lang.management.ManagementFactory.getThreadMXBean();

  private AuditBenchmark() {}

  public static void main(String[] args) throws IOException {
    int utterances = args.length > 0 ? Integer.parseInt(args[0]) : 10_000;
    int per = args.length > 1 ? Integer.parseInt(args[1]) : 100;
    int rounds = args.length > 2 ? Integer.parseInt(args[2]) : 5;
    Path dir = Files.createTempDirectory("steelyard-audit-bench");
    try {
      run(dir, utterances, per, rounds);
    } finally {
      try (var files = Files.list(dir)) {
        for (Path p : (Iterable<Path>) files::iterator) Files.delete(p);
      }
      Files.delete(dir);
    }
  }

  private static void run(Path dir, int utterances, int per, int rounds) throws IOException {
    long t0 = System.nanoTime();
    Path modelFile = dir.resolve("lm3.arpa");
    SyntheticModel.train(dir, modelFile);
    LanguageModel lm = ModelFiles.load(modelFile);
    Path hyps = dir.resolve("hyps.csv");
    SyntheticHypotheses.write(hyps, (long) utterances * per, per, 42L);
    Normaliser norm = Normaliser.create(NormalisationOptions.EXACT);
    Tokenizer words = raw -> norm.tokens(raw, Unit.WORD);
    RescoreWeights w = new RescoreWeights(Map.of("acoustic", 1.0, "lm", 1.0), 0.05, 0, 0, 1, Map.of(), 100, 0, 0,
        LatticeSettings.DEFAULT_BEAM, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
    List<String> features = List.of("acoustic", "lm");
    NbestRescorer rescorer = new NbestRescorer(new HypothesisScorer(lm, words, words, 2, 0), features, w, RescoreMethod.NBEST, lm,
        () -> new Aligner()::distance);
    List<AuditInput> inputs = new ArrayList<>(utterances);
    long hypotheses = 0;
    ImportOptions options = ImportOptions.strict(List.of(FeatureSpec.parse("acoustic"), FeatureSpec.parse("lm")));
    try (HypothesesReader r = HypothesesReader.open(hyps, options)) {
      while (r.hasNext()) {
        UtteranceHypotheses u = r.next();
        hypotheses += u.size();
        UtteranceResult res = rescorer.rescore(u);
        String ref = u.first().text();
        inputs.add(new AuditInput(res, words.tokenize(ref.substring(ref.indexOf(' ') + 1)), null));
      }
    }
    System.out.printf(Locale.ROOT, "setup: %d utterances, %d hypotheses, %.1f s%n", inputs.size(), hypotheses,
        (System.nanoTime() - t0) / 1e9);
    OverruleAuditor auditor = new OverruleAuditor(AuditSettings.of(features, Unit.WORD, lm, words, w.latticeSettings()));
    for (int round = 0; round < rounds; round++) {
      long gc = gcMillis();
      long cpu = THREADS.getCurrentThreadCpuTime();
      long start = System.nanoTime();
      AuditReport report = auditor.auditAll(inputs);
      double s = (System.nanoTime() - start) / 1e9;
      double c = (THREADS.getCurrentThreadCpuTime() - cpu) / 1e9;
      System.out.printf(Locale.ROOT, "round %d: audit of %d overrules (%d helped, %d hurt, %d neutral): %.3f s wall, "
          + "%.3f s thread CPU, %d ms in GC%n", round, report.total().overrules(), report.total().helped(),
          report.total().hurt(), report.total().neutral(), s, c, gcMillis() - gc);
    }
  }

  private static long gcMillis() {
    long ms = 0;
    for (var b : java.lang.management.ManagementFactory.getGarbageCollectorMXBeans()) ms += Math.max(0, b.getCollectionTime());
    return ms;
  }
}
