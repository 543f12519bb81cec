package steelyard.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import steelyard.io.Hypothesis;
import steelyard.lm.ModelFiles;

/**
 * The tuning targets of issue 8 measured end to end: {@code steelyard tune} in a child JVM on files (reading and
 * scoring the hypotheses with the model, tuning, writing the weights and the JSON), on the generated dev set of
 * {@link TuneBenchData} (default 10 000 utterances × 100 hypotheses = 1 M) written as CSV with its 3-gram as ARPA.
 * An existing {@code DIR} with the files is reused (generation is not timed either way). Targets: a full N-best tune of three weights with five restarts ≤ 10 s, a lattice-method tune of 10 000
 * utterances ≤ 60 s, on 2 cores. Prints the wall time of each run (JVM start included) and, with GNU time installed, its CPU time and peak memory.
 *
 * <pre>
 * mvn -o -q -B test-compile
 * mvn -o -q dependency:build-classpath -Dmdep.outputFile=cp.txt -Dmdep.includeScope=test
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.TuneCommandBench [UTTS] [HYPS] [DIR] [XMX]
 * </pre>
 */
public final class TuneCommandBench {
  /** GNU time, for the child's CPU time and peak resident memory, when installed. */
  private static final String TIME = "/usr/bin/time";

  private TuneCommandBench() {}

  public static void main(String[] args) throws Exception {
    int utts = args.length > 0 ? Integer.parseInt(args[0]) : 10_000;
    int hyps = args.length > 1 ? Integer.parseInt(args[1]) : 100;
    Path dir = args.length > 2 ? Path.of(args[2]) : Files.createTempDirectory("steelyard-tune-bench");
    String xmx = args.length > 3 ? args[3] : "4g";
    Files.createDirectories(dir);
    long t = System.nanoTime();
    boolean reuse = Files.exists(dir.resolve("dev.nbest.csv")) && Files.exists(dir.resolve("model.arpa"));
    if (!reuse) write(dir, utts, hyps);
    System.out.printf(Locale.ROOT, "data: %d utterances x %d hypotheses %s %s in %.1f s (%d MB)%n", utts, hyps,
        reuse ? "already in" : "written to", dir, secs(t), Files.size(dir.resolve("dev.nbest.csv")) >> 20);
    String[] common = {"tune", "--hyps", dir.resolve("dev.nbest.csv").toString(), "--refs", dir.resolve("dev.refs.csv").toString(),
        "--lm", dir.resolve("model.arpa").toString(), "--features", "acoustic,lm", "--threads", "2"};
    run("N-best, 3 weights (lm, lm_weight, length_weight), 5 restarts, no folds", xmx, dir, common, "--method", "nbest", "--tune",
        "lm,lm_weight,length_weight", "--folds", "0");
    run("N-best, 3 weights, 5 restarts, 5 folds", xmx, dir, common, "--method", "nbest", "--tune", "lm,lm_weight,length_weight");
    run("lattice, default weights, no folds", xmx, dir, common, "--method", "lattice", "--folds", "0");
    run("lattice, default weights, 5 folds", xmx, dir, common, "--method", "lattice");
  }

  /** The hypotheses ({@code utt_id,rank,text,acoustic,lm,group}), the references and the model. */
  static void write(Path dir, int utts, int hyps) throws IOException {
    try (BufferedWriter h = Files.newBufferedWriter(dir.resolve("dev.nbest.csv"), StandardCharsets.UTF_8);
        BufferedWriter r = Files.newBufferedWriter(dir.resolve("dev.refs.csv"), StandardCharsets.UTF_8)) {
      h.write("utt_id,rank,text,acoustic,lm,group\n");
      r.write("utt_id,text,group\n");
      IOException[] failed = new IOException[1];
      TuneBenchData.generate(utts, hyps, 20261202L, model -> ModelFiles.save(model, dir.resolve("model.arpa")), (u, list, ref) -> {
        try {
          String group = "g" + (u % 10);
          for (Hypothesis x : list.hypotheses())
            h.write(String.format(Locale.ROOT, "%s,%d,%s,%.4f,%.4f,%s%n", x.uttId(), x.rank(), x.text(), x.features()[0], x.features()[1],
                group));
          r.write(list.uttId() + "," + ref + "," + group + "\n");
        } catch (IOException e) {
          failed[0] = e;
        }
      });
      if (failed[0] != null) throw failed[0];
    }
  }

  private static void run(String what, String xmx, Path dir, String[] common, String... more) throws Exception {
    List<String> cmd = new ArrayList<>();
    if (Files.isExecutable(Path.of(TIME))) cmd.addAll(List.of(TIME, "-f", "cpu: %U s user, %S s system, peak RSS %M KB"));
    cmd.addAll(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx" + xmx, "-cp",
        System.getProperty("java.class.path"), "steelyard.cli.Main"));
    cmd.addAll(List.of(common));
    cmd.addAll(List.of(more));
    cmd.addAll(List.of("--out", dir.resolve("tuned.weights.json").toString(), "--json", dir.resolve("tune.json").toString()));
    long t = System.nanoTime();
    Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve("tune.log").toFile()).start();
    long pid = p.pid();
    if (!p.waitFor(30, TimeUnit.MINUTES)) {
      p.destroyForcibly();
      throw new IllegalStateException("tune did not finish: " + what);
    }
    double wall = secs(t);
    String log = Files.readString(dir.resolve("tune.log"));
    String summary = log.lines().filter(l -> l.contains("(95 %") || l.startsWith("steelyard tune:") || l.startsWith("cpu: ")).reduce("", (a, b) -> a + "\n    " + b);
    System.out.printf(Locale.ROOT, "%s: exit %d, %.1f s wall (pid %d)%s%n", what, p.exitValue(), wall, pid, summary);
    if (p.exitValue() != 0) System.out.println(log);
  }

  private static double secs(long from) {
    return (System.nanoTime() - from) / 1e9;
  }
}
