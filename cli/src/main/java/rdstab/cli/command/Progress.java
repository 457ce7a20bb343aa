package rdstab.cli.command;

import java.time.Duration;
import java.time.temporal.ChronoUnit;
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;

/**
 * A progress bar with rate and time left on stderr, or nothing: it is silent with --quiet and when
 * there is no terminal (System.console() is null, e.g. output redirected, a batch job or a test).
 */
final class Progress implements AutoCloseable {

    private final ProgressBar bar;

    private Progress(ProgressBar bar) {
        this.bar = bar;
    }

    static Progress start(int total, int alreadyDone, boolean quiet) {
        if (quiet || System.console() == null) {
            return new Progress(null);
        }
        ProgressBar b = new ProgressBarBuilder().setTaskName("sweep").setInitialMax(total)
                .setConsumer(new ConsoleProgressBarConsumer(System.err)).setUnit(" points", 1)
                .showSpeed().setSpeedUnit(ChronoUnit.SECONDS).startsFrom(alreadyDone, Duration.ZERO)
                .setUpdateIntervalMillis(500).build();
        return new Progress(b);
    }

    void step() {
        if (bar != null) {
            bar.step();
        }
    }

    @Override
    public void close() {
        if (bar != null) {
            bar.close();
        }
    }
}
