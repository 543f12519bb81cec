package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
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
    PrintWriter err = spec.commandLine().getErr();
    OutputSet outputs = OutputSet.open(java.util.Collections.singletonMap("--csv", csv), java.util.List.of(input.lm, text));
    CompactModel lm = input.load(err);
    var tokenizer = LmModelInput.tokenizer(lm, normalisation, spec.commandLine().getParseResult(), err);
    Perplexity scorer = new Perplexity(lm);
    LmModelInput.writeText(csv, w -> {
      w.write("line,tokens,oov,log10_prob\n");
      StringBuilder sb = new StringBuilder();
      LmModelInput.forEachSentence(text, tokenizer, (line, tokens) -> {
        SentenceScore s = scorer.add(line, tokens);
        sb.setLength(0);
        sb.append(s.line()).append(',').append(s.words()).append(',').append(s.oov()).append(',')
            .append(String.format(Locale.ROOT, "%.6f", s.log10Prob())).append('\n');
        try {
          w.write(sb.toString());
        } catch (java.io.IOException e) {
          throw new java.io.UncheckedIOException(e);
        }
      }, warning -> LmModelInput.warn(err, warning));
    });
    outputs.commit();
    return 0;
  }
}
