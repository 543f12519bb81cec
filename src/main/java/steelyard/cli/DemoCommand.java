package steelyard.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.eval.EditCounts;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.demo.DemoFiles;
import steelyard.io.InputException;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreRun;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreSummary;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

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

  /** One demo run: a label, its output stem, its hypotheses and references files, and its rescoring configuration. */
  private record Part(String label, String stem, Path hyps, Path refs, RescoreConfig config) {}

  @Override
  public Integer call() {
    Path root = dataDir != null ? dataDir : DemoFiles.root();
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
    PrintWriter err = spec.commandLine().getErr();
    out.println("Steelyard demo: the invented Tallowmere Produce Cooperative (voice logs and scanned delivery dockets)");
    out.println("Weights were chosen on the dev sets (models/*-demo.weights.json); results below are on the held-out test sets.");
    out.println();
    ImportOptions imports = new ImportOptions(List.of(), null, 0, w -> RescoreSupport.warn(err, w), s -> { });
    List<Part> parts = List.of(
        new Part("Voice logs, word N-best rescoring (acoustic + first-pass LM + domain 3-gram)", "voice-test",
            data.resolve("voice-test.nbest.csv"), data.resolve("voice-test.refs.csv"), RescoreConfig.builder()
                .features(FeatureSpec.parseList("acoustic,lm"))
                .normalisation(new NormalisationOptions(false, false, false, false, data.resolve("voice.rules")))
                .modelPath(models.resolve("voice-3gram.arpa.gz"))
                .weightsFile(models.resolve("voice-demo.weights.json"))
                .unit(Unit.WORD)
                .method(RescoreMethod.NBEST)
                .importOptions(imports).build()),
        new Part("Delivery dockets, OCR system combination in a character confusion network with a 5-gram", "dockets-test",
            data.resolve("dockets-test.nbest.csv"), data.resolve("dockets-test.refs.csv"), RescoreConfig.builder()
                .features(FeatureSpec.parseList("confidence"))
                .modelPath(models.resolve("dockets-char-5gram.arpa.gz"))
                .weightsFile(models.resolve("dockets-demo.weights.json"))
                .unit(Unit.CHAR)
                .method(RescoreMethod.LATTICE)
                .importOptions(imports).build()));
    for (Part p : parts) printSummary(out, p, runPart(p, err));
    out.println("Outputs in " + outDir + "/: *.picks.csv (the chosen transcript per utterance), *.summary.json, *.breakdown.csv (every hypothesis's score terms).");
    out.println("An automatic pick is not a verified transcript: transcripts with legal, medical or safety weight need review by a person.");
    out.flush();
    return Main.OK;
  }

  private RescoreRun.Result runPart(Part p, PrintWriter err) {
    RescoreSession session = RescoreSession.open(p.config());
    session.warnings().forEach(w -> RescoreSupport.warn(err, w));
    RescoreRun.Outputs outputs = new RescoreRun.Outputs(outDir.resolve(p.stem() + ".picks.csv"), outDir.resolve(p.stem() + ".breakdown.csv"),
        outDir.resolve(p.stem() + ".summary.json"), null);
    RescoreRun.Result r = RescoreRun.run(session, p.hyps(), p.refs(), outputs, run.effectiveThreads(), run.seed, List.of(),
        spec.commandLine().getOut());
    r.runWarnings().forEach(w -> RescoreSupport.warn(err, w));
    return r;
  }

  private static void printSummary(PrintWriter out, Part p, RescoreRun.Result r) {
    RescoreSummary s = r.summary();
    String unit = p.config().unit() == Unit.CHAR ? "CER" : "WER";
    out.println(p.label());
    out.printf(Locale.ROOT, "  %s chosen   %6.2f %%  (95 %% interval %.2f %% to %.2f %%)%n", unit,
        100 * rate(s.chosen()), 100 * r.ci95().low(), 100 * r.ci95().high());
    out.printf(Locale.ROOT, "  %s rank 1   %6.2f %%  (the recogniser's own choice)%n", unit, 100 * rate(s.first()));
    out.printf(Locale.ROOT, "  %s oracle   %6.2f %%  (best hypothesis in each list: the N-best lower bound)%n", unit, 100 * rate(s.oracle()));
    out.printf(Locale.ROOT, "  %d of %d choices differ from rank 1%s%n%n", s.changed(), s.scored(),
        s.newTranscripts() > 0 ? "; " + s.newTranscripts() + " are new transcripts no single output contains" : "");
    out.flush();
  }

  private static double rate(EditCounts c) {
    return (double) c.errors() / c.referenceTokens();
  }

}
