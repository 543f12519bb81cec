package steelyard.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.AtomicOutput;
import steelyard.io.HypothesesReader;
import steelyard.io.InputException;
import steelyard.io.JsonOutput;
import steelyard.io.OutputSet;
import steelyard.io.UtteranceHypotheses;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeChoice;
import steelyard.lattice.NetworkExport;
import steelyard.report.OutputPaths;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * {@code steelyard network}: the confusion network of one utterance, with the posteriors {@code rescore}
 * gives its hypotheses for the network methods, exported as Graphviz DOT and as an arc CSV, and on request the
 * k best paths of the LM search with their score terms. Reads the hypotheses file only up to the utterance.
 */
@Command(
    name = "network",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = "Export one utterance's confusion network (DOT, arc CSV) and its k best paths.")
public final class NetworkCommand implements Callable<Integer> {
  @Mixin HypothesesInput input;
  @Mixin NormalisationInput normalisation;
  @Mixin RescoreWeightOptions weightOptions;
  @Spec CommandSpec spec;

  @Option(names = "--utt", required = true, paramLabel = "ID", description = "The utterance whose network is exported.")
  String uttId;

  @Mixin LmModelInput model;


  @Option(names = "--dot", paramLabel = "FILE", description = "Graphviz DOT of the network.")
  Path dot;

  @Option(names = "--arcs", paramLabel = "FILE", description = "CSV with one row per arc (slot, token, posterior, hypotheses).")
  Path arcs;

  @Option(names = "--kbest", paramLabel = "K", defaultValue = "0", description = "List the K best paths of the LM search (0 = none).")
  int kbest;

  @Mixin JsonOutputOption json;

  @Override
  public Integer call() {
    if (kbest < 0) throw InputException.option("--kbest", "is " + kbest, "0 or a positive number");
    Map<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--dot", dot);
    outputs.put("--arcs", arcs);
    outputs.put("--json", json.file);
    OutputSet outputSet = OutputSet.open(outputs, Arrays.asList(input.hyps, model.lm, weightOptions.weightsFile, normalisation.rules));

    PrintWriter err = spec.commandLine().getErr();
    PrintWriter out = spec.commandLine().getOut();
    // Consensus builds the same network as the lattice search; the search (and so the model) is needed only for --kbest.
    RescoreSession session = RescoreSession.open(RescoreSupport.config(spec, input, normalisation, model, weightOptions)
        .method(kbest > 0 ? RescoreMethod.LATTICE : RescoreMethod.CONSENSUS).build());
    session.warnings().forEach(w -> RescoreSupport.warn(err, w));
    ScoredUtterance s = session.score(find(session));
    UtteranceResult r = session.choose(s);
    ConfusionNetwork net = r.network();
    List<LatticeChoice> paths = kbest == 0 ? List.of() : session.kBestPaths(r, kbest);
    Unit unit = session.unit();

    if (dot != null) AtomicOutput.writeText(dot, out, w -> NetworkExport.writeDot(net, uttId, w));
    if (arcs != null) AtomicOutput.writeText(arcs, out, w -> NetworkExport.writeCsv(net, w));
    if (kbest > 0 && !OutputPaths.isStdout(json.file)) printPaths(out, paths, unit);
    if (json.file != null) JsonOutput.write(json.file, summary(s, net, paths, unit, session.weights()), out);
    outputSet.commit();
    err.printf(Locale.ROOT, "steelyard network: %s: %d hypotheses, %d entered, %d slots, %d arcs%s%n",
        uttId, s.size(), net.enteredCount(), net.slotCount(), net.arcCount(),
        net.capped() ? " (the hypothesis cap applied)" : "");
    err.flush();
    return Main.OK;
  }

  /** Streams the hypotheses file up to the utterance; its absence is an input error naming --utt. */
  private UtteranceHypotheses find(RescoreSession session) {
    try (HypothesesReader reader = session.open(input.hyps)) {
      while (reader.hasNext()) {
        UtteranceHypotheses u = reader.next();
        if (u.uttId().equals(uttId)) return u;
      }
    }
    throw InputException.option("--utt", "utterance '" + uttId + "' is not in " + input.hyps, "an utt_id of the hypotheses file");
  }

  private static void printPaths(PrintWriter out, List<LatticeChoice> paths, Unit unit) {
    out.println("rank\tscore\tlog_posterior\tlm_ln_p\ttokens\tnew\ttext");
    for (int r = 0; r < paths.size(); r++) {
      LatticeChoice c = paths.get(r);
      out.printf(Locale.ROOT, "%d\t%.6f\t%.6f\t%.6f\t%d\t%s\t%s%n", r + 1, c.score(), c.logPosterior(), c.lmLogProb(),
          c.tokenCount(), c.isNewTranscript() ? "yes" : "no", Normaliser.join(c.tokens(), unit));
    }
    out.flush();
  }

  private ObjectNode summary(ScoredUtterance s, ConfusionNetwork net, List<LatticeChoice> paths, Unit unit,
      RescoreWeights weights) {
    ObjectNode node = JsonOutput.object();
    node.put("utt_id", uttId);
    node.put("unit", unit.label());
    node.put("hypotheses", s.size());
    node.put("entered", net.enteredCount());
    node.put("capped", net.capped());
    node.put("slots", net.slotCount());
    node.put("arcs", net.arcCount());
    ArrayNode list = node.putArray("paths");
    for (int r = 0; r < paths.size(); r++) {
      LatticeChoice c = paths.get(r);
      ObjectNode p = list.addObject();
      p.put("rank", r + 1);
      p.put("text", Normaliser.join(c.tokens(), unit));
      p.put("score", round(c.score()));
      p.put("log_posterior", round(c.logPosterior()));
      p.put("lm_ln_p", round(c.lmLogProb()));
      p.put("tokens", c.tokenCount());
      p.put("new", c.isNewTranscript());
    }
    node.set("weights", JsonOutput.parse(WeightsFile.toJson(WeightsSpec.of(weights, unit, null))));
    return node;
  }

  /** Fixed decimals so that reruns give the same bytes on every platform. */
  private static java.math.BigDecimal round(double v) {
    return new java.math.BigDecimal(String.format(Locale.ROOT, "%.6f", v));
  }
}
