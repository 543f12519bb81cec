package steelyard.cli;

import picocli.CommandLine.Option;

/** Options shared by every command that uses randomness or threads. */
public final class RunInput {
  /** The fixed default seed, recorded in every output that used randomness. */
  public static final long DEFAULT_SEED = 20261202L;

  @Option(names = "--seed", paramLabel = "N", defaultValue = "20261202", description = "Random seed (default ${DEFAULT-VALUE}); recorded in the output.")
  public long seed;

  @Option(names = "--threads", paramLabel = "N", defaultValue = "0", description = "Worker threads; 0 = all cores (default). Results do not depend on it.")
  public int threads;

  /** The thread count in effect (all cores when 0). */
  public int effectiveThreads() {
    return threads > 0 ? threads : Runtime.getRuntime().availableProcessors();
  }
}
