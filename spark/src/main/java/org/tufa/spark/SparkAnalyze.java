package org.tufa.spark;

import java.io.PrintWriter;
import java.util.Arrays;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.tufa.cli.AnalyzeCommand;
import org.tufa.cli.Tufa;
import picocli.CommandLine;

/**
 * The Spark job: {@code spark-submit --class org.tufa.spark.SparkAnalyze tufa-spark.jar --model ... --trends ...
 * --out ...}. Takes the options of {@code tufa analyze} (the same command, with each unit's analysis run on the
 * executors by {@link SparkUnitEngine}) and {@code --partitions}; writes the same files. The options are checked
 * and the model read before Spark starts, so a wrong command line fails in a second with one line.
 */
public final class SparkAnalyze {

    private SparkAnalyze() {
    }

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true),
                new SparkConf()));
    }

    /**
     * Runs the job; the Spark context is made from {@code conf} when the first unit is to be analysed and stopped
     * before this returns.
     *
     * @param conf Spark settings (spark-submit fills in the master and the rest; tests set {@code local[2]})
     * @return the exit code of {@code tufa analyze}
     */
    public static int run(String[] args, PrintWriter out, PrintWriter err, SparkConf conf) {
        boolean debug = Arrays.asList(args).contains("--debug");
        String[] rest = Arrays.stream(args).filter(a -> !a.equals("--debug")).toArray(String[]::new);
        LazyContext context = new LazyContext(conf);
        try {
            SparkUnitEngine engine = new SparkUnitEngine(context::get);
            CommandLine cli = new CommandLine(new AnalyzeCommand(engine));
            cli.addMixin("spark", engine);
            cli.setCommandName("tufa-spark");
            return Tufa.configured(cli, out, err, debug).execute(rest);
        } finally {
            context.stop();
        }
    }

    /** The Spark context, started on first use (after the command line and the model have been checked). */
    private static final class LazyContext {
        private final SparkConf conf;
        private JavaSparkContext context;

        LazyContext(SparkConf conf) {
            this.conf = conf.clone();
        }

        synchronized JavaSparkContext get() {
            if (context == null) {
                conf.setIfMissing("spark.app.name", "tufa analyze");
                // Spark's INFO lines would bury tufa's summary; its warnings and errors still show.
                conf.setIfMissing("spark.log.level", "WARN");
                context = new JavaSparkContext(conf);
            }
            return context;
        }

        synchronized void stop() {
            if (context != null) {
                context.stop();
                context = null;
            }
        }
    }
}
