package steelyard.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import steelyard.lm.ModelFiles;
import steelyard.lm.train.CorpusFile;
import steelyard.lm.train.SentenceSource;
import steelyard.lm.train.Smoothing;
import steelyard.lm.train.TrainedModel;
import steelyard.lm.train.Trainer;
import steelyard.lm.train.TrainingOptions;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * Training throughput: a 4-gram modified Kneser-Ney model on a seeded Zipf corpus (about 50 k words,
 * exponent 1.0, 10 M tokens by default). One timed run (training a model this size takes seconds, so a
 * microbenchmark harness adds nothing); not part of the test suite.
 *
 * <pre>
 * mvn -o -q -B test-compile
 * java -Xmx3g -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.TrainBenchmark [tokens] [vocab] [order]
 * </pre>
 *
 * Prints: counting + estimation seconds (wall and process CPU, so that a run on a busy machine can still be
 * judged) from pre-split tokens (no file, no normalisation); the same from the corpus file through the
 * normaliser; ARPA writing seconds; n-grams per order; heap used after training; the system load average.
 */
public final class TrainBenchmark {
  private TrainBenchmark() {}

  private static com.sun.management.OperatingSystemMXBean os() {
    return (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
  }

  public static void main(String[] args) throws Exception {
    long tokens = args.length > 0 ? Long.parseLong(args[0]) : 10_000_000L;
    int vocab = args.length > 1 ? Integer.parseInt(args[1]) : 50_000;
    int order = args.length > 2 ? Integer.parseInt(args[2]) : 4;
    long seed = 20261202L;
    double exponent = 1.0;
    TrainingOptions options = TrainingOptions.of(order, Smoothing.MKN);
    System.out.printf(Locale.ROOT, "corpus: %d tokens, Zipf vocabulary %d, exponent %.2f, seed %d; %d-gram MKN; %d cores, max heap %d MB%n",
        tokens, vocab, exponent, seed, order, Runtime.getRuntime().availableProcessors(),
        Runtime.getRuntime().maxMemory() >> 20);

    SentenceSource generated = sink -> {
      ZipfCorpus corpus = new ZipfCorpus(tokens, vocab, exponent, seed);
      long line = 0;
      while (corpus.hasNext()) sink.accept(++line, Arrays.asList(corpus.next().split(" ")));
    };
    System.out.printf(Locale.ROOT, "system load average before: %.2f%n", os().getSystemLoadAverage());
    long t0 = System.nanoTime();
    long c0 = os().getProcessCpuTime();
    TrainedModel trained = new Trainer(options).train(generated);
    double s = (System.nanoTime() - t0) / 1e9;
    double cpu = (os().getProcessCpuTime() - c0) / 1e9;
    System.out.printf(Locale.ROOT, "train from generated tokens: %.2f s wall, %.2f s CPU of this process (all threads, GC included)%n", s, cpu);
    System.out.printf(Locale.ROOT, "system load average after: %.2f%n", os().getSystemLoadAverage());
    System.out.println("n-grams per order: " + Arrays.toString(trained.report().listedNgrams()));
    System.gc();
    Runtime rt = Runtime.getRuntime();
    System.out.printf(Locale.ROOT, "heap in use with the model: %d MB%n", (rt.totalMemory() - rt.freeMemory()) >> 20);

    Path dir = Files.createTempDirectory("steelyard-train-bench");
    Path text = dir.resolve("zipf.txt");
    Path arpa = dir.resolve("zipf.arpa");
    try {
      ZipfCorpus.write(text, tokens, vocab, exponent, seed);
      Normaliser normaliser = Normaliser.create(NormalisationOptions.EXACT);
      trained = null;
      System.gc();
      long t1 = System.nanoTime();
      long c1 = os().getProcessCpuTime();
      trained = new Trainer(options).train(new CorpusFile(text, normaliser, Unit.WORD));
      System.out.printf(Locale.ROOT, "train from the corpus file (normalised): %.2f s wall, %.2f s CPU%n",
          (System.nanoTime() - t1) / 1e9, (os().getProcessCpuTime() - c1) / 1e9);
      long t2 = System.nanoTime();
      ModelFiles.save(trained.backoffModel(), arpa);
      System.out.printf(Locale.ROOT, "ARPA writing: %.2f s, %d MB%n", (System.nanoTime() - t2) / 1e9, Files.size(arpa) >> 20);
    } finally {
      for (Path p : List.of(arpa, text)) Files.deleteIfExists(p);
      Files.deleteIfExists(dir);
    }
  }
}
