namespace CdsNatremia.Fhir.Knowledge;

/// <summary>A knowledge file is missing, malformed or invalid; the message names the file and the problem.</summary>
public sealed class KnowledgeLoadException : Exception
{
    /// <summary>Creates the exception.</summary>
    public KnowledgeLoadException(string message) : base(message)
    {
    }

    /// <summary>Creates the exception with a cause.</summary>
    public KnowledgeLoadException(string message, Exception inner) : base(message, inner)
    {
    }

    /// <summary>Creates the exception.</summary>
    public KnowledgeLoadException()
    {
    }
}
