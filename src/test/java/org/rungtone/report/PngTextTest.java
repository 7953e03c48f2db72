package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.Optional;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;

class PngTextTest {
    private static byte[] plainPng() throws IOException {
        BufferedImage image = new BufferedImage(3, 2, BufferedImage.TYPE_INT_RGB);
        image.setRGB(1, 1, 0x123456);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ImageIO.write(image, "png", out);
        return out.toByteArray();
    }

    @Test
    void carriesADescriptionThatImageReadersAccept() throws IOException {
        byte[] plain = plainPng();
        String text = "Spectrum of the board's output for door_chime, 0\u20138 kHz, dBFS";
        byte[] described = PngText.withDescription(plain, text);
        assertEquals(Optional.of(text), PngText.description(described));
        assertEquals(Optional.empty(), PngText.description(plain));
        // the chunk's CRC is right: a strict reader decodes the same pixels
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(described));
        assertEquals(0x123456, back.getRGB(1, 1) & 0xffffff);
        assertEquals(3, back.getWidth());
    }

    @Test
    void everyPlotSaysWhatItShows() {
        Plots.Chart c = Plots.Chart.of("t", "x", "y", java.util.List.of(new Plots.Series("s",
                new double[] {0, 1}, new double[] {0, 1}, Plots.Style.LINE)), java.util.List.of(), "what it shows");
        assertEquals(Optional.of("what it shows"), PngText.description(Plots.png(c)));
    }
}
