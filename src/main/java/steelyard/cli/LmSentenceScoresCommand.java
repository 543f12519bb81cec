package steelyard.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.AtomicOutput;
import steelyard.io.CsvWriter;
import steelyard.io.OutputSet;
import steelyard.lm.CompactModel;
import steelyard.lm.eval.Perplexity;
import steelyard.lm.eval.SentenceScore;

/** Per-sentence log-probabilities of a text, as rescoring uses them. */
@Command(name = "sentence-scores", mixinStandardHelpOptions = true,
    description = "One CSV row per line of the text: line, tokens, oov, log10_prob (including </s> and the <unk> scores of out-of-vocabulary tokens).")
public final class LmSentenceScoresCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;
  @Mixin NormalisationInput normalisation;

  @Option(names = "--text", required = true, paramLabel = "FILE", description = "Text, one sentence per line (.gz accepted).")
  Path text;

  @Option(names = "--csv", required = true, paramLabel = "FILE", description = "Output CSV ('-' = stdout).")
  Path csv;

  @Override
  public Integer call() {
    input.require();
    PrintWriter err = spec.commandLine().getErr();
    OutputSet outputs = OutputSet.open(java.util.Collections.singletonMap("--csv", csv), java.util.List.of(input.lm, text));
    CompactModel lm = input.load(err);
    var tokenizer = LmModelInput.tokenizer(lm, normalisation, spec.commandLine().getParseResult(), err);
    Perplexity scorer = new Perplexity(lm);
    AtomicOutput.writeText(csv, spec.commandLine().getOut(), w -> {
      CsvWriter rows = CsvWriter.plain(w);
      rows.row("line", "tokens", "oov", "log10_prob");
      LmModelInput.forEachSentence(text, tokenizer, (line, tokens) -> {
        SentenceScore s = scorer.add(line, tokens);
        try {
          rows.row(Long.toString(s.line()), Integer.toString(s.words()), Integer.toString(s.oov()), String.format(Locale.ROOT, "%.6f", s.log10Prob()));
        } catch (IOException e) {
          throw new UncheckedIOException(e);
        }
      }, warning -> LmModelInput.warn(err, warning));
      rows.flush();
    });
    outputs.commit();
    return 0;
  }
}
