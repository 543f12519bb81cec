package steelyard.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.InputException;
import steelyard.io.OutputSet;

/**
 * Runs the main job on the bundled demo data: the invented produce-warehouse cooperative's voice logs
 * (word N-best lists, rescored with the bundled word 3-gram model) and scanned delivery dockets (several OCR
 * configurations per line, combined in a character confusion network searched with the bundled character
 * 5-gram model). Weights come from the bundled weights files, chosen on the dev sets; the demo applies them
 * to the held-out test sets, exactly as a user applies dev-tuned weights to new data.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
    description = "Run the main job on the bundled demo data and models: pick the best transcript of every "
        + "test utterance and docket line with dev-tuned weights, and report the error rates against rank 1.")
public final class DemoCommand implements Callable<Integer> {
  @Spec CommandLine.Model.CommandSpec spec;

  @Option(names = "--data-dir", paramLabel = "DIR",
      description = "Project folder holding sample-hypotheses/ and models/ (default: the one this program was built in, else the current folder).")
  Path dataDir;

  @Option(names = "--out-dir", paramLabel = "DIR", defaultValue = "demo-out",
      description = "Where the picks, summaries and breakdowns are written (default ${DEFAULT-VALUE}).")
  Path outDir;

  @Mixin RunInput run;

  /** One demo run: a label, its output stem and the rescore arguments that differ. */
  private record Part(String label, String stem, List<String> args) {}

  @Override
  public Integer call() throws IOException {
    Path root = dataDir != null ? dataDir : projectRoot();
    Path data = root.resolve("sample-hypotheses");
    Path models = root.resolve("models");
    if (!Files.isDirectory(data) || !Files.isDirectory(models))
      throw InputException.option("--data-dir", "no sample-hypotheses/ and models/ under " + root, "the Steelyard project folder");
    try {
      Files.createDirectories(outDir);
    } catch (IOException e) {
      throw InputException.option("--out-dir", "cannot create " + outDir + " (" + e.getMessage() + ")", "a writable folder");
    }
    PrintWriter out = spec.commandLine().getOut();
    out.println("Steelyard demo: the invented Tallowmere Produce Cooperative (voice logs and scanned delivery dockets)");
    out.println("Weights were chosen on the dev sets (models/*-demo.weights.json); results below are on the held-out test sets.");
    out.println();
    List<Part> parts = List.of(
        new Part("Voice logs, word N-best rescoring (acoustic + first-pass LM + domain 3-gram)", "voice-test", List.of(
            "--hyps", data.resolve("voice-test.nbest.csv").toString(),
            "--refs", data.resolve("voice-test.refs.csv").toString(),
            "--rules", data.resolve("voice.rules").toString(),
            "--lm", models.resolve("voice-3gram.arpa.gz").toString(),
            "--weights", models.resolve("voice-demo.weights.json").toString(),
            "--features", "acoustic,lm", "--method", "nbest")),
        new Part("Delivery dockets, OCR system combination in a character confusion network with a 5-gram", "dockets-test", List.of(
            "--hyps", data.resolve("dockets-test.nbest.csv").toString(),
            "--refs", data.resolve("dockets-test.refs.csv").toString(),
            "--lm", models.resolve("dockets-char-5gram.arpa.gz").toString(),
            "--weights", models.resolve("dockets-demo.weights.json").toString(),
            "--features", "confidence", "--unit", "char", "--method", "lattice")));
    // All six outputs are one set: the two rescore runs stage into it, and a failure leaves demo-out/ as it was.
    Map<String, Path> outputs = new LinkedHashMap<>();
    for (Part p : parts) for (String kind : List.of(".picks.csv", ".summary.json", ".breakdown.csv")) outputs.put(p.stem() + kind, outDir.resolve(p.stem() + kind));
    OutputSet outputSet = OutputSet.open(outputs, List.of());
    for (Part p : parts) {
      int code = runPart(p);
      if (code != 0) return code;
    }
    outputSet.commit();
    for (Part p : parts) printSummary(out, p);
    out.println("Outputs in " + outDir + "/: *.picks.csv (the chosen transcript per utterance), *.summary.json, *.breakdown.csv (every hypothesis's score terms).");
    out.println("An automatic pick is not a verified transcript: transcripts with legal, medical or safety weight need review by a person.");
    out.flush();
    return 0;
  }

  private int runPart(Part p) {
    List<String> args = new ArrayList<>();
    args.add("rescore");
    args.addAll(p.args());
    args.addAll(List.of(
        "--out", outDir.resolve(p.stem() + ".picks.csv").toString(),
        "--json", outDir.resolve(p.stem() + ".summary.json").toString(),
        "--breakdown", outDir.resolve(p.stem() + ".breakdown.csv").toString(),
        "--threads", Integer.toString(run.threads),
        "--seed", Long.toString(run.seed)));
    CommandLine cl = Main.commandLine();
    cl.setOut(spec.commandLine().getOut());
    // The rescore summary on stderr repeats what printSummary shows; keep only warnings, or all on failure.
    java.io.StringWriter captured = new java.io.StringWriter();
    cl.setErr(new PrintWriter(captured, true));
    int code = cl.execute(args.toArray(new String[0]));
    PrintWriter err = spec.commandLine().getErr();
    for (String line : captured.toString().split("\n")) {
      if (code != 0 || line.startsWith("steelyard: warning")) err.println(line);
    }
    err.flush();
    return code;
  }

  private void printSummary(PrintWriter out, Part p) throws IOException {
    JsonNode j = new ObjectMapper().readTree(outDir.resolve(p.stem() + ".summary.json").toFile());
    String unit = "char".equals(j.path("unit").asText()) ? "CER" : "WER";
    out.println(p.label());
    out.printf(Locale.ROOT, "  %s chosen   %6.2f %%  (95 %% interval %.2f %% to %.2f %%)%n", unit,
        100 * j.path("error_rate").asDouble(), 100 * j.path("ci95_low").asDouble(), 100 * j.path("ci95_high").asDouble());
    out.printf(Locale.ROOT, "  %s rank 1   %6.2f %%  (the recogniser's own choice)%n", unit, 100 * j.path("first_error_rate").asDouble());
    out.printf(Locale.ROOT, "  %s oracle   %6.2f %%  (best hypothesis in each list: the N-best lower bound)%n", unit,
        100 * j.path("oracle_error_rate").asDouble());
    out.printf(Locale.ROOT, "  %d of %d choices differ from rank 1%s%n%n", j.path("changed").asInt(), j.path("utterances").asInt(),
        j.path("new_transcripts").asInt() > 0 ? "; " + j.path("new_transcripts").asInt() + " are new transcripts no single output contains" : "");
    out.flush();
  }

  /** The folder above {@code target/} when running from the built jar, else the current folder. */
  private static Path projectRoot() {
    try {
      Path jar = Path.of(DemoCommand.class.getProtectionDomain().getCodeSource().getLocation().toURI());
      Path candidate = jar.getParent() == null ? null : jar.getParent().getParent();
      if (candidate != null && Files.isDirectory(candidate.resolve("sample-hypotheses"))) return candidate;
    } catch (URISyntaxException | SecurityException | NullPointerException e) {
      // fall through to the current folder
    }
    return Path.of("").toAbsolutePath();
  }
}
