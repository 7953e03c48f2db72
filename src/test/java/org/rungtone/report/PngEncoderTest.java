package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;

class PngEncoderTest {
    /** A chart like a build's error spectrum: 2048 noisy points, two reference lines, a legend. */
    private static Plots.Chart noisyChart() {
        Random random = new Random(7);
        double[] x = new double[2048];
        double[] y = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            x[i] = i * 8.0 / x.length;
            y[i] = -95 + 8 * random.nextGaussian();
        }
        return new Plots.Chart("Error spectrum", PlotAxis.exact("frequency (kHz)", 0, 8),
                PlotAxis.rounded("error density (dBFS/Hz)", -130, -60),
                List.of(new Plots.Series("error", x, y, Plots.Style.LINE)),
                List.of(Plots.Reference.horizontal("ideal error density", -92.5),
                        Plots.Reference.vertical("in-band cutoff 7.2 kHz", 7.2)), "noise \u2013 dashed lines");
    }

    private static int[] pixels(BufferedImage image) {
        return image.getRGB(0, 0, image.getWidth(), image.getHeight(), null, 0, image.getWidth());
    }

    @Test
    void decodesToTheDrawnPixelsAsTheJdkEncoderDid() throws IOException {
        BufferedImage drawn = ChartRenderer.image(noisyChart());
        byte[] png = PngEncoder.encode(drawn, "noise \u2013 dashed lines");
        BufferedImage ours = ImageIO.read(new ByteArrayInputStream(png));
        ByteArrayOutputStream jdk = new ByteArrayOutputStream();
        ImageIO.write(drawn, "png", jdk);
        BufferedImage theirs = ImageIO.read(new ByteArrayInputStream(jdk.toByteArray()));
        assertEquals(ChartRenderer.WIDTH, ours.getWidth());
        assertEquals(ChartRenderer.HEIGHT, ours.getHeight());
        assertArrayEquals(pixels(drawn), pixels(ours));
        assertArrayEquals(pixels(theirs), pixels(ours));
        assertEquals(Optional.of("noise \u2013 dashed lines"), PngText.description(png));
    }

    @Test
    void keepsEveryByteValueOfEveryChannel() throws IOException {
        BufferedImage image = new BufferedImage(256, 3, BufferedImage.TYPE_INT_RGB);
        for (int x = 0; x < 256; x++) {
            image.setRGB(x, 0, x << 16 | (255 - x) << 8 | x * 7 & 0xff);
            image.setRGB(x, 1, (255 - x) << 16 | x << 8 | x * 13 & 0xff);
            image.setRGB(x, 2, 0xffffff);
        }
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(PngEncoder.encode(image, "")));
        assertArrayEquals(pixels(image), pixels(back));
    }

    @Test
    void refusesImagesWithAlpha() {
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class, () -> PngEncoder.encode(
                new BufferedImage(2, 2, BufferedImage.TYPE_INT_ARGB), ""));
    }
}
