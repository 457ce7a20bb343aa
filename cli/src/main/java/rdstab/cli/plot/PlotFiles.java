package rdstab.cli.plot;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.internal.chartpart.Chart;
import rdstab.cli.output.AtomicFiles;

/**
 * Saves a chart as NAME.png and NAME.svg (text in the SVG is drawn as outlines, so the file needs no fonts and
 * no external resource). Both go through {@link AtomicFiles}: a reader never sees half a picture.
 */
public final class PlotFiles {

    private PlotFiles() {
    }

    /**
     * Writes {@code dir/name.png} and {@code dir/name.svg}.
     *
     * @return the two paths written
     */
    public static List<Path> save(Chart<?, ?> chart, Path dir, String name, boolean overwrite) {
        Path png = dir.resolve(name + ".png");
        Path svg = dir.resolve(name + ".svg");
        AtomicFiles.write(png, png(chart), overwrite);
        AtomicFiles.write(svg, svg(chart), overwrite);
        return List.of(png, svg);
    }

    /** The chart as PNG bytes. */
    public static byte[] png(Chart<?, ?> chart) {
        try {
            return BitmapEncoder.getBitmapBytes(chart, BitmapEncoder.BitmapFormat.PNG);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot encode a PNG image: " + e.getMessage(), e);
        }
    }

    /** The chart as SVG bytes (UTF-8). */
    public static byte[] svg(Chart<?, ?> chart) {
        try {
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            VectorGraphicsEncoder.saveVectorGraphic(chart, out, VectorGraphicsEncoder.VectorGraphicsFormat.SVG);
            return out.toByteArray();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot encode an SVG image: " + e.getMessage(), e);
        }
    }
}
