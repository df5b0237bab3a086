using MathNet.Numerics.LinearAlgebra;
using RunWatch.Core.Model;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class LeastSquaresTests
{
    [Theory]
    [InlineData(7, 2, 1)]
    [InlineData(30, 3, 2)]
    [InlineData(12, 4, 3)]
    public void SolveQr_RandomProblem_MatchesMathNetQrSolve(int rows, int cols, int seed)
    {
        // Reference: MathNet.Numerics Matrix.QR().Solve (Householder QR of a general-purpose library).
        var random = new Random(seed);
        var a = new double[rows * cols];
        var b = new double[rows];
        for (int i = 0; i < a.Length; i++)
        {
            a[i] = random.NextDouble() - 0.5;
        }
        for (int i = 0; i < rows; i++)
        {
            b[i] = random.NextDouble();
        }
        Matrix<double> matrix = Matrix<double>.Build.Dense(rows, cols, (i, j) => a[(i * cols) + j]);
        Vector<double> expected = matrix.QR().Solve(Vector<double>.Build.DenseOfArray(b));
        Matrix<double> expectedGramInverse = (matrix.TransposeThisAndMultiply(matrix)).Inverse();

        var solution = new double[cols];
        var r = new double[cols * cols];
        Assert.True(LeastSquares.SolveQr((double[])a.Clone(), rows, cols, (double[])b.Clone(), solution, r));
        double[] gramInverse = LeastSquares.InverseGram(r, cols);

        for (int j = 0; j < cols; j++)
        {
            Assert.Equal(expected[j], solution[j], 12);
            for (int k = 0; k < cols; k++)
            {
                Assert.Equal(expectedGramInverse[j, k], gramInverse[(j * cols) + k], 9);
            }
        }
    }

    [Fact]
    public void SolveQr_RankDeficient_ReturnsFalse()
    {
        // DERIVED: two equal columns have rank 1.
        double[] a = [1, 1, 2, 2, 3, 3];
        Assert.False(LeastSquares.SolveQr(a, 3, 2, new double[] { 1, 2, 3 }, new double[2], new double[4]));
    }
}
