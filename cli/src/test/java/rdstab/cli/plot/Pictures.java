package rdstab.cli.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import org.w3c.dom.Document;

/** Test helpers: decode pictures and check that something, not nothing, is drawn. */
public final class Pictures {

    /**
     * Minimum standard deviation of the grey level (0..255) for a picture to count as "not blank": a white page
     * with a frame and a few tick labels already exceeds it only slightly, a drawn chart by far (common practice,
     * no source; chosen from the charts' own numbers, 20–60).
     */
    public static final double NOT_BLANK_STDDEV = 10;

    private Pictures() {
    }

    /** Decodes a PNG file and checks its size and that it is not blank. */
    public static BufferedImage png(Path p, int width, int height) throws IOException {
        assertTrue(Files.size(p) > 0, p + " is empty");
        BufferedImage img = ImageIO.read(p.toFile());
        assertTrue(img != null, p + " does not decode as an image");
        assertEquals(width, img.getWidth(), "width of " + p);
        assertEquals(height, img.getHeight(), "height of " + p);
        assertTrue(greyStdDev(img) > NOT_BLANK_STDDEV, p + " looks blank: grey-level spread " + greyStdDev(img));
        return img;
    }

    /** Decodes PNG bytes. */
    public static BufferedImage png(byte[] bytes) throws IOException {
        return ImageIO.read(new ByteArrayInputStream(bytes));
    }

    /** Parses an SVG file as XML (the external DTD is not fetched) and checks the root element and its size. */
    public static Document svg(Path p, int width, int height) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        DocumentBuilder b = f.newDocumentBuilder();
        Document d = b.parse(p.toFile());
        assertEquals("svg", d.getDocumentElement().getLocalName());
        assertEquals("0 0 " + width + " " + height, d.getDocumentElement().getAttribute("viewBox"));
        assertTrue(d.getElementsByTagName("path").getLength() > 10, p + " has almost nothing drawn");
        return d;
    }

    /** Standard deviation of the grey level over all pixels. */
    public static double greyStdDev(BufferedImage img) {
        double s = 0;
        double s2 = 0;
        long n = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int rgb = img.getRGB(x, y);
                double g = (((rgb >> 16) & 255) + ((rgb >> 8) & 255) + (rgb & 255)) / 3.0;
                s += g;
                s2 += g * g;
                n++;
            }
        }
        double m = s / n;
        return Math.sqrt(Math.max(0, s2 / n - m * m));
    }

    /** Number of pixels within {@code tol} (per channel) of a colour. */
    public static int count(BufferedImage img, Color c, int tol) {
        int k = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if (near(img.getRGB(x, y), c, tol)) {
                    k++;
                }
            }
        }
        return k;
    }

    public static boolean near(int rgb, Color c, int tol) {
        return Math.abs(((rgb >> 16) & 255) - c.getRed()) <= tol && Math.abs(((rgb >> 8) & 255) - c.getGreen()) <= tol
                && Math.abs((rgb & 255) - c.getBlue()) <= tol;
    }

    /** A translucent colour as it appears over white. */
    public static Color overWhite(Color c) {
        double a = c.getAlpha() / 255.0;
        return new Color((int) Math.round(255 + (c.getRed() - 255) * a), (int) Math.round(255 + (c.getGreen() - 255) * a),
                (int) Math.round(255 + (c.getBlue() - 255) * a));
    }

    /**
     * Finds the drawn curve of colour c: {leftmost column, rightmost column, mean column of the topmost row}.
     * Pixels of exactly the curve colour only (anti-aliased edges differ), so grid lines and text never count.
     */
    public static double[] curveExtent(BufferedImage img, Color c) {
        int left = Integer.MAX_VALUE;
        int right = -1;
        int topY = Integer.MAX_VALUE;
        double topX = 0;
        int topN = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if ((img.getRGB(x, y) & 0xffffff) == (c.getRGB() & 0xffffff)) {
                    left = Math.min(left, x);
                    right = Math.max(right, x);
                    if (y < topY) {
                        topY = y;
                        topX = 0;
                        topN = 0;
                    }
                    if (y == topY) {
                        topX += x;
                        topN++;
                    }
                }
            }
        }
        assertTrue(right >= 0, "no pixel of the curve colour " + c + " found");
        return new double[] {left, right, topX / topN};
    }
}
